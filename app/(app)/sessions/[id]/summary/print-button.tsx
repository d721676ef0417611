'use client';
// Opens the browser's print dialog (the page's print.css lays it out for paper).
import { buttonClass } from '@/components/ui/button';

export function PrintButton() {
  return (
    <button type="button" className={buttonClass('secondary')} onClick={() => window.print()} data-print="hide">
      Print
    </button>
  );
}
