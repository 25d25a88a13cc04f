/**
 * The primary element and the fluid of a meter run's configuration, as two sections of a
 * set-up form (a new meter run, a new configuration version). Every edit is reported through
 * onEdited as well, so the form can clear a stale server refusal.
 */
import { ElementFields } from './ElementFields';
import type { ElementDraft } from './elementDraft';
import { FluidFields } from './FluidFields';
import type { FluidDraft } from './fluidDraft';
import { FormSection } from './FormSection';
import type { FieldErrors } from './formFields';

interface ElementAndFluidSectionsProps {
  element: ElementDraft;
  fluid: FluidDraft;
  onElementChange: (next: ElementDraft) => void;
  onFluidChange: (next: FluidDraft) => void;
  /** Called after either change. */
  onEdited: () => void;
  errors: FieldErrors;
  /** The form's test-id prefix, which the fields' test ids start with. */
  testPrefix: string;
  titles: { element: string; fluid: string };
  /** Test ids of the two sections themselves; none when left out. */
  sectionTestIDs?: { element: string; fluid: string };
}

export function ElementAndFluidSections({
  element,
  fluid,
  onElementChange,
  onFluidChange,
  onEdited,
  errors,
  testPrefix,
  titles,
  sectionTestIDs,
}: ElementAndFluidSectionsProps) {
  return (
    <>
      <FormSection title={titles.element} testID={sectionTestIDs?.element}>
        <ElementFields
          draft={element}
          onChange={(next) => {
            onElementChange(next);
            onEdited();
          }}
          errors={errors}
          testPrefix={testPrefix}
        />
      </FormSection>
      <FormSection title={titles.fluid} testID={sectionTestIDs?.fluid}>
        <FluidFields
          draft={fluid}
          onChange={(next) => {
            onFluidChange(next);
            onEdited();
          }}
          errors={errors}
          testPrefix={testPrefix}
        />
      </FormSection>
    </>
  );
}
