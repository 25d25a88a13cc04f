/**
 * Names the browser tab after the open area ("Alarms · Tallyrun"), so a control room with many
 * tabs can tell them apart. Does nothing off the web.
 */
import { useEffect } from 'react';
import { Platform } from 'react-native';

/** @param title the page's own title; the product name is added */
export function useDocumentTitle(title: string): void {
  useEffect(() => {
    if (Platform.OS === 'web' && typeof document !== 'undefined') document.title = `${title} · Tallyrun`;
  }, [title]);
}
