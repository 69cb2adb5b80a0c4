// The proposal PDF's shared vocabulary (API and web): where a rendering stands. Pure.

/** Where a proposal's rendering stands: waiting in the queue, being drawn, ready, or refused. */
export const PROPOSAL_STATUSES = ['queued', 'rendering', 'done', 'failed'] as const;
export type ProposalStatus = (typeof PROPOSAL_STATUSES)[number];

/** Words the web shows for each status. */
export const PROPOSAL_STATUS_WORDS: Record<ProposalStatus, string> = {
  queued: 'Waiting to be drawn',
  rendering: 'Being drawn',
  done: 'Ready',
  failed: 'Could not be made',
};

/** The proposal's sections, in order (the PDF draws them; the web's preview lists them). */
export const PROPOSAL_SECTIONS = [
  'Cover: project, client, version and review status',
  'Key figures',
  'Basis of design',
  'Results over the discharge range',
  'Tailwater against the depth the jump needs (chart)',
  'Specific energy at the design discharge (chart)',
  'Basin choice and the alternatives compared',
  'Plan and section, dimensioned',
  'Exit protection and slab flotation',
  'Quantities and cost',
  'Warnings and cautions',
  'References',
  'Prepared by and reviewed by',
] as const;
