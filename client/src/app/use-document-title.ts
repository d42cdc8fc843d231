import { useEffect } from 'react';

/** Each screen names itself in the tab, so a list of tabs or a screen reader's window list says where you are. */
export function useDocumentTitle(title: string) {
  useEffect(() => {
    const before = document.title;
    document.title = `${title} · Bumpboard`;
    return () => {
      document.title = before;
    };
  }, [title]);
}
