// A project's issued versions and their review: the list (with the design's status and whether
// the signed-in member is a marked reviewer), and the steps on it. Every step reloads the list.
import { ref, watch, type Ref } from 'vue';
import { versionsApi, type Version, type VersionList } from '@/api/versions';
import { useResource } from '@/composables/useResource';

export function useVersions(projectId: Ref<string>) {
  const { data, busy, error, reload } = useResource<VersionList | null>(
    (signal) => versionsApi.list(projectId.value, signal),
    { initial: null, what: 'the issued versions' },
  );
  watch(projectId, () => void reload(), { immediate: true });
  const acting = ref(false);

  /** Runs one step (throws the ApiError for the caller to show) and reloads the list. */
  async function step(run: () => Promise<Version>): Promise<Version> {
    acting.value = true;
    try {
      return await run();
    } finally {
      acting.value = false;
      void reload();
    }
  }

  const id = () => projectId.value;
  return {
    list: data,
    busy,
    error,
    reload,
    acting,
    issue: (revision: number, note: string) =>
      step(() => versionsApi.issue(id(), { revision, note })),
    send: (versionId: string) => step(() => versionsApi.send(id(), versionId)),
    approve: (versionId: string, comments: string) =>
      step(() => versionsApi.approve(id(), versionId, comments)),
    giveBack: (versionId: string, comments: string) =>
      step(() => versionsApi.giveBack(id(), versionId, comments)),
    /** Both versions in full, for a comparison. */
    pair: (a: string, b: string) =>
      Promise.all([versionsApi.get(id(), a), versionsApi.get(id(), b)]),
  };
}
