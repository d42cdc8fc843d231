import { useEffect, useRef } from 'react';
import { useLocation } from 'react-router-dom';
import { setPageTitle } from '../../lib/document-title';

// The navigation whose heading has already taken focus: one arrival moves focus once, whatever redraws follow.
let arrivedAt: string | null = null;

/**
 * Every screen calls this with its title: the tab's title names the screen, and on arrival (first load, a link, a
 * route change, sign-in) focus moves to the screen's heading, so a screen reader reads where the user now is and
 * the next Tab starts from the top of the new content, never from a control that is gone. A heading that replaces a
 * loading one in the same navigation takes focus only if focus fell to the page body; it never pulls focus away from
 * a control the user has moved to.
 */
export function useArrival<T extends HTMLElement = HTMLHeadingElement>(title: string) {
  const heading = useRef<T>(null);
  const { key, pathname } = useLocation();
  const arrival = `${key}:${pathname}`;

  useEffect(() => setPageTitle(title), [title]);

  useEffect(() => {
    const el = heading.current;
    if (!el) return;
    const active = document.activeElement;
    const focusLost = !active || active === document.body || !active.isConnected;
    if (arrivedAt !== arrival || focusLost) {
      arrivedAt = arrival;
      el.focus({ preventScroll: false });
    }
  }, [arrival]);

  return heading;
}
