/**
 * The confirmation step of shelving (ISA-18.2: shelving is time-limited and has a reason): how
 * long, and why. Nothing is sent until the reason is given and "Shelve" is pressed; a problem is
 * named under its field, whether this form or the server found it.
 */
import { useState } from 'react';

import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { ReasonDialog } from '@/components/ui/ReasonDialog';

/** Choices up to the server's limit of a day (server/resources/alarms/schema.ts MAX_SHELVE_MINUTES). */
const durations = [
  { value: '15', label: '15 min' },
  { value: '30', label: '30 min' },
  { value: '60', label: '1 h' },
  { value: '120', label: '2 h' },
  { value: '240', label: '4 h' },
  { value: '480', label: '8 h' },
  { value: '1440', label: '24 h' },
] as const;
type Duration = (typeof durations)[number]['value'];

interface ShelveDialogProps {
  /** What is shelved, e.g. "DP low in range on MR-1-DP". */
  subject: string;
  busy: boolean;
  /** A refusal from the server that names a field. */
  fieldError?: { field?: string; message: string } | null;
  onConfirm: (minutes: number, reason: string) => void;
  onCancel: () => void;
}

export function ShelveDialog({ subject, busy, fieldError, onConfirm, onCancel }: ShelveDialogProps) {
  const [minutes, setMinutes] = useState<Duration>('60');
  const chosen = durations.find((d) => d.value === minutes)!;

  const serverReason = fieldError?.field === 'reason' ? fieldError.message : undefined;
  const serverOther = fieldError && fieldError.field !== 'reason' ? fieldError.message : undefined;
  return (
    <ReasonDialog
      title={`Shelve ${subject}`}
      explanation="A shelved alarm is not announced for the time chosen; its condition is still tracked, and it comes back by itself when the time is over."
      ariaLabel="Shelve the alarm"
      testIDPrefix="shelve"
      missingReason='Say why the alarm is shelved (for example "transmitter being calibrated").'
      reasonError={serverReason}
      otherError={serverOther}
      confirmLabel={`Shelve for ${chosen.label}`}
      busy={busy}
      onConfirm={(reason) => onConfirm(Number(minutes), reason)}
      onCancel={onCancel}
    >
      <ChoiceGroup
        label="For how long"
        options={durations}
        value={minutes}
        onChange={setMinutes}
        testIDPrefix="shelve-minutes"
      />
    </ReasonDialog>
  );
}
