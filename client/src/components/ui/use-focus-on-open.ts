import { useEffect, useRef } from 'react';

/**
 * For a form or panel that opens in place when asked for (Add, Edit, New): on open its heading takes focus, so the
 * keyboard continues inside it and a screen reader says what opened, even when the button that opened it is gone.
 * On close, if focus fell to the page body with it, focus goes back to the control that opened it, or else to the
 * screen's heading: never the top of the page.
 */
export function useFocusOnOpen<T extends HTMLElement = HTMLHeadingElement>() {
  const ref = useRef<T>(null);
  useEffect(() => {
    const opener = document.activeElement instanceof HTMLElement && document.activeElement !== document.body ? document.activeElement : null;
    ref.current?.focus();
    return () => {
      // After the closing render: a result message that takes focus has done so by then.
      requestAnimationFrame(() => {
        const active = document.activeElement;
        if (active && active !== document.body && active.isConnected) return;
        const back = opener?.isConnected ? opener : document.querySelector<HTMLElement>('main h1');
        back?.focus();
      });
    };
  }, []);
  return ref;
}
