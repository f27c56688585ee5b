import { useEffect, useEffectEvent, type RefObject } from 'react';

/**
 * Copy and paste for an element that holds the focus. Chromium sends clipboard events to the
 * element holding the text selection, which need not be the focused grid, so they are caught on
 * the document while the element itself has the focus.
 */
export function useDocumentClipboard(
  elementRef: RefObject<HTMLElement | null>,
  handlers: { onCopy: (event: ClipboardEvent) => void; onPaste: (event: ClipboardEvent) => void },
) {
  const onClipboard = useEffectEvent((event: ClipboardEvent) => {
    if (!elementRef.current || document.activeElement !== elementRef.current) return;
    if (event.type === 'paste') handlers.onPaste(event);
    else handlers.onCopy(event);
  });
  useEffect(() => {
    const listener = (event: ClipboardEvent) => onClipboard(event);
    document.addEventListener('paste', listener);
    document.addEventListener('copy', listener);
    return () => {
      document.removeEventListener('paste', listener);
      document.removeEventListener('copy', listener);
    };
  }, []);
}
