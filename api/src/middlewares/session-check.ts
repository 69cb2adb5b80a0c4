import { QueryTypes, type Sequelize } from 'sequelize';
import type { TokenClaims } from '../modules/auth/auth.tokens';

interface SessionRow {
  id: string;
  token_version: number;
  active: boolean;
  firm_id: string;
}

interface Waiting {
  claims: TokenClaims;
  resolve: (current: boolean) => void;
  reject: (error: unknown) => void;
}

/**
 * Answers "is this token still the member's current one?" (member exists and is active, same
 * firm, same token version) straight from the users table, with no cache: a sign-out, a
 * password change or a deactivation committed before a request arrives is always seen.
 *
 * Checks that arrive in the same turn of the event loop share one primary-key query
 * (`WHERE id = ANY(...)`), issued after every one of them arrived, so batching never answers
 * from data older than the request. Under load this turns N round trips into one.
 */
export class SessionChecker {
  private waiting: Waiting[] = [];
  private scheduled = false;

  constructor(private readonly sequelize: Sequelize) {}

  isCurrent(claims: TokenClaims): Promise<boolean> {
    return new Promise((resolve, reject) => {
      this.waiting.push({ claims, resolve, reject });
      if (!this.scheduled) {
        this.scheduled = true;
        setImmediate(() => void this.flush());
      }
    });
  }

  private async flush(): Promise<void> {
    const batch = this.waiting;
    this.waiting = [];
    this.scheduled = false;
    const ids = [...new Set(batch.map((w) => w.claims.sub))];
    let rows: SessionRow[];
    try {
      rows = await this.sequelize.query<SessionRow>(
        'SELECT id, token_version, active, firm_id FROM users WHERE id = ANY(CAST(:ids AS uuid[]))',
        { replacements: { ids: `{${ids.join(',')}}` }, type: QueryTypes.SELECT, raw: true },
      );
    } catch (error) {
      for (const w of batch) w.reject(error);
      return;
    }
    const byId = new Map(rows.map((r) => [r.id, r]));
    for (const { claims, resolve } of batch) {
      const row = byId.get(claims.sub);
      resolve(
        row !== undefined &&
          row.active &&
          row.token_version === claims.tv &&
          row.firm_id === claims.fid,
      );
    }
  }
}
