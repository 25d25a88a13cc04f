/** The safety note of the set-up screens: the configuration describes equipment under pressure. */
import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';

export function SetupCaution() {
  return (
    <Notice title="Safety" testID="setup-caution">
      <AppText>
        Meter runs carry pressurised gas, steam and hot water. Field work behind these settings (pulling an orifice
        plate, changing a cone, re-ranging or valving in a transmitter) follows the site’s permits and isolation
        procedures, local codes and licensed practice. Tallyrun records what was done; it does not make the work safe.
      </AppText>
    </Notice>
  );
}
