import type { Health } from './health.service';

export function presentHealth(health: Health): Health {
  return { status: health.status, db: health.db };
}
