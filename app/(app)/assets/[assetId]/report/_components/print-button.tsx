"use client";

import { Button } from "@/components/ui/button";

/** Opens the browser's print dialog (the page's print styles hide the controls). */
export function PrintButton() {
  return (
    <Button onClick={() => window.print()} data-testid="report-print">
      Print
    </Button>
  );
}
