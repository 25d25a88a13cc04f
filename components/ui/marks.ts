/**
 * The marks of the display, one meaning each (ISA-101: a shape means one thing everywhere).
 * ▲ ◆ ■ belong to the alarm priorities alone (constants/theme.ts alarmStyle); nothing else draws
 * them. A form error or a failed action, a flag on a record or a date, and a neutral note each
 * have their own mark, always beside words, so none needs its colour to be read.
 */
export const marks = {
  /** A form error, a refused or failed action, a lost connection: something the person must put right or retry. */
  error: '⊗',
  /** A flag on a record or a due date (calibration overdue, over range in an hour, substituted …): a fact to look at. */
  flag: '⚑',
  /** A neutral note. */
  info: 'i',
  /** Finished as asked. */
  done: '✓',
} as const;

/** The alarm priorities' shapes, which only alarm priorities may use. */
export const priorityShapes = ['▲', '◆', '■'] as const;
