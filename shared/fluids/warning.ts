/**
 * A non-fatal remark attached to a result: `code` is a stable dotted identifier
 * (e.g. 'fluid.defaultViscosity'), `message` a sentence for people.
 */
export interface Warning {
  code: string;
  message: string;
}
