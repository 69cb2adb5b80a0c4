// The code of each step of the design workspace, loaded when the step is first shown. It lives
// here rather than in the view so that the router, entering the workspace, can start the opened
// step's code beside the workspace's own instead of after it (router/index.ts).
import {
  defineAsyncComponent,
  defineComponent,
  h,
  onBeforeUnmount,
  onMounted,
  ref,
  type Component,
} from 'vue';

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

/** Each step's component once its code has arrived. */
const loaded: Partial<Record<DesignStepKey, Component>> = {};

function load(key: DesignStepKey): Promise<Component> {
  return STEP_LOADERS[key]().then((m) => (loaded[key] = m.default));
}

/** Starts loading the code of the step a workspace address names (`?step=`; Site by default). */
export function preloadStep(step: unknown): void {
  const key: DesignStepKey =
    typeof step === 'string' && step in STEP_LOADERS ? (step as DesignStepKey) : 'site';
  // A failure shows where the step is drawn (its async component), not here.
  load(key).catch(() => undefined);
}

/**
 * A step's component for the workspace. When the step's code is already in (the router started
 * it), the step is drawn in the task right after the page around it, without waiting for a
 * frame; an async component would draw it only after its own import resolved and a frame was
 * drawn (at 4x CPU throttling that put off the opened step's results by 60-100 ms), and drawn in
 * the same task as the page it made that task the longest of the load. Otherwise an async
 * component stands in and loads it. The choice is made once per use, so a step is never drawn
 * twice over.
 */
export function stepComponent(key: DesignStepKey): Component {
  const whenLoading = defineAsyncComponent(() => load(key));
  return defineComponent({
    name: 'DesignStep',
    inheritAttrs: false,
    setup(_, { attrs }) {
      const component = loaded[key] ?? whenLoading;
      // In a task of its own, right after the page around it (no frame waited for).
      const shown = ref(false);
      onMounted(() => {
        const t = setTimeout(() => (shown.value = true), 0);
        onBeforeUnmount(() => clearTimeout(t));
      });
      return () => (shown.value ? h(component, { ...attrs }) : null);
    },
  });
}
