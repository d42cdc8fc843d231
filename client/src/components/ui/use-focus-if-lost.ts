import { useEffect, useRef } from 'react';

/**
 * For what an action draws in place of the control that was used (a form replaced by its result): on mount, if focus
 * fell to the page body because that control is gone, it moves here, so the next Tab continues from the result and
 * a screen reader reads it. Focus the user has put elsewhere is left alone.
 */
export function useFocusIfLost<T extends HTMLElement>() {
  const ref = useRef<T>(null);
  useEffect(() => {
    const active = document.activeElement;
    if (!active || active === document.body) ref.current?.focus();
  }, []);
  return ref;
}
