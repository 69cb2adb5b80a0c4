// The code of each step of the design workspace, loaded when the step is first shown. It lives
// here rather than in the view so that the router, entering the workspace, can start the opened
// step's code beside the workspace's own instead of after it (router/index.ts).
export const STEP_LOADERS = {
  site: () => import('@/components/DesignSiteStep.vue'),
  flows: () => import('@/components/DesignFlowsStep.vue'),
  inflow: () => import('@/components/DesignInflowStep.vue'),
  jump: () => import('@/components/DesignJumpCheckStep.vue'),
  basin: () => import('@/components/DesignBasinChoiceStep.vue'),
  sizing: () => import('@/components/DesignSizingStep.vue'),
  takeoff: () => import('@/components/DesignTakeoffStep.vue'),
  estimate: () => import('@/components/DesignEstimateStep.vue'),
  proposal: () => import('@/components/DesignProposalStep.vue'),
} as const;

export type DesignStepKey = keyof typeof STEP_LOADERS;

/** Starts loading the code of the step a workspace address names (`?step=`; Site by default). */
export function preloadStep(step: unknown): void {
  const key: DesignStepKey =
    typeof step === 'string' && step in STEP_LOADERS ? (step as DesignStepKey) : 'site';
  // A failure shows where the step is drawn (its async component), not here.
  STEP_LOADERS[key]().catch(() => undefined);
}
