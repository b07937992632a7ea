// Who acts at the dock: anyone with an id and a role (session users, seed and test actors).
import type { Actor } from '@/lib/quotes/access';

export type DockActor = Pick<Actor, 'id' | 'role' | 'name'>;
