import type { ReactNode } from 'react';
import { LinkTabs } from '@/components/ui/tabs';

const SECTIONS = [
  { href: '/quality', label: 'Lots' },
  { href: '/quality/bake-board', label: 'Bake windows' },
  { href: '/quality/nonconformances', label: 'Nonconformances' },
  { href: '/quality/certificates', label: 'Certificates' },
  { href: '/quality/efficiency', label: 'Current efficiency' },
  { href: '/quality/sampling', label: 'Sampling plan' },
] as const;

// Shapes the Quality pages only; each page checks its own permission.
export default function QualityLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex flex-col gap-5">
      <LinkTabs items={SECTIONS} label="Quality sections" />
      {children}
    </div>
  );
}
