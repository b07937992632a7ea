import 'server-only';
import { AppError } from '@/lib/errors';

// Two imports of the same rows at once: the checks passed for both, the second hits the unique
// index. Nothing of it was written (its transaction rolled back); say so plainly.
export async function conflictOnUnique<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (e) {
    if ((e as { code?: unknown }).code === '23505') {
      throw new AppError('CONFLICT', 'Some of these records were added by someone else a moment ago. Nothing was imported; check the list and try again.');
    }
    throw e;
  }
}
