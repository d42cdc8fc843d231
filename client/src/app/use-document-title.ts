import { useEffect } from 'react';
import { setPageTitle } from '../lib/document-title';

/**
 * Each screen names itself in the tab, so a list of tabs or a screen reader's window list says where you are; the
 * alert count the shell keeps stays in front of it.
 */
export function useDocumentTitle(title: string) {
  useEffect(() => setPageTitle(title), [title]);
}
