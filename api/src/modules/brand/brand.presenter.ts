import { planAllows, type Plan } from '@basinwright/common';
import type { Firm } from '../../models';

export interface BrandView {
  firmName: string;
  plan: Plan;
  /** False on Concept: the brand is kept but proposals print unbranded with the watermark. */
  onProposals: boolean;
  color: string | null;
  footer: string | null;
  sealStatement: string | null;
  logo: { updatedAt: string } | null;
}

export function presentBrand(firm: Firm): BrandView {
  return {
    firmName: firm.name,
    plan: firm.plan,
    onProposals: planAllows(firm.plan, 'brandedProposals'),
    color: firm.brandColor,
    footer: firm.proposalFooter,
    sealStatement: firm.sealStatement,
    logo:
      firm.logo === null || firm.logoUpdatedAt === null
        ? null
        : { updatedAt: firm.logoUpdatedAt.toISOString() },
  };
}
