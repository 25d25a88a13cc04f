/**
 * The confirmation step of taking an alarm out of service (maintenance, engineers and admins):
 * a reason is required, and the alarm stays out of service until someone returns it.
 */
import { ReasonDialog } from '@/components/ui/ReasonDialog';

interface OutOfServiceDialogProps {
  subject: string;
  busy: boolean;
  serverError?: string | null;
  onConfirm: (reason: string) => void;
  onCancel: () => void;
}

export function OutOfServiceDialog({ subject, busy, serverError, onConfirm, onCancel }: OutOfServiceDialogProps) {
  return (
    <ReasonDialog
      title={`Take ${subject} out of service`}
      explanation="Out of service is for maintenance: the alarm is not announced until it is returned to service, however long that takes."
      ariaLabel="Take the alarm out of service"
      testIDPrefix="out-of-service"
      missingReason='Say why the alarm is taken out of service (for example "transmitter removed for repair").'
      reasonError={serverError ?? undefined}
      confirmLabel="Take out of service"
      busy={busy}
      onConfirm={onConfirm}
      onCancel={onCancel}
    />
  );
}
