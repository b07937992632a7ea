import type { AnalysisVerdict } from '@/db/types';
import { VERDICT_STATUS } from '@/lib/bath/display';
import { StatusBadge } from '../ui/status-badge';

/** A bath verdict as shape + word: in range, near a limit, out of range (or no reading). */
export function VerdictBadge({ verdict, size = 'md', detail }: { verdict: AnalysisVerdict | null; size?: 'sm' | 'md' | 'lg'; detail?: string }) {
  return <StatusBadge status={verdict ? VERDICT_STATUS[verdict] : 'none'} size={size} detail={detail} />;
}
