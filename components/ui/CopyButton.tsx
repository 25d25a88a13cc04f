/**
 * Copies a text to the clipboard (web: navigator.clipboard) and says it did. Where no clipboard
 * is reachable (an insecure origin, a native build) it says so, and the text stays selectable.
 */
import { useEffect, useState } from 'react';

import { Button } from './Button';

interface CopyButtonProps {
  text: string;
  /** What is copied, e.g. "password". */
  what: string;
  testID?: string;
}

const confirmationMs = 2_500;

export function CopyButton({ text, what, testID }: CopyButtonProps) {
  const [state, setState] = useState<'idle' | 'copied' | 'unavailable'>('idle');
  useEffect(() => {
    if (state === 'idle') return;
    const timer = setTimeout(() => setState('idle'), confirmationMs);
    return () => clearTimeout(timer);
  }, [state]);

  const copy = async () => {
    const clipboard = typeof navigator !== 'undefined' ? navigator.clipboard : undefined;
    if (!clipboard?.writeText) {
      setState('unavailable');
      return;
    }
    try {
      await clipboard.writeText(text);
      setState('copied');
    } catch {
      setState('unavailable');
    }
  };

  const label =
    state === 'copied' ? `✓ Copied` : state === 'unavailable' ? 'Cannot copy here: select the text' : `Copy ${what}`;
  return (
    <Button
      label={label}
      size="compact"
      onPress={() => void copy()}
      testID={testID}
      accessibilityLabel={`Copy ${what}`}
    />
  );
}
