'use client';

import { Button } from '@/components/ui/button';

export function PrintButton() {
  return (
    <Button size="lg" onClick={() => window.print()}>
      Print label
    </Button>
  );
}
