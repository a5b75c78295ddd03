import { useEffect } from 'react';

/** Sets the browser tab title as "<page> · Cribra" while the page is shown. */
export function useDocumentTitle(page: string): void {
  useEffect(() => {
    const before = document.title;
    document.title = page ? `${page} · Cribra` : 'Cribra';
    return () => {
      document.title = before;
    };
  }, [page]);
}
