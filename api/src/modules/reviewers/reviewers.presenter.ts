import type { ReviewerCredential } from '../../models';

export interface ReviewerView {
  licenceNumber: string;
  jurisdiction: string;
  /** printed with the reviewer's signature */
  statement: string;
}

export function presentReviewer(c: ReviewerCredential | null | undefined): ReviewerView | null {
  if (c == null) return null;
  return { licenceNumber: c.licenceNumber, jurisdiction: c.jurisdiction, statement: c.statement };
}
