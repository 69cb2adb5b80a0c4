// A project's proposals: the list, making one from an issued version and following it until
// it is ready (the job reports queued → being drawn → ready, or why it could not be made),
// downloading it and e-mailing it to the client.
import { onBeforeUnmount, ref, watch, type Ref } from 'vue';
import { proposalsApi, type Proposal } from '@/api/proposals';
import { useResource } from '@/composables/useResource';
import { downloadBlob } from '@/download';

/** How often a proposal being drawn is asked about, ms. */
export const PROPOSAL_POLL_MS = 1500;

export function useProposals(projectId: Ref<string>) {
  const { data, busy, error, reload } = useResource<Proposal[]>(
    async (signal) => (await proposalsApi.list(projectId.value, signal)).items,
    { initial: [], what: 'the proposals' },
  );
  watch(projectId, () => void reload(), { immediate: true });

  let timer: ReturnType<typeof setTimeout> | undefined;
  let stopped = false;
  onBeforeUnmount(() => {
    stopped = true;
    clearTimeout(timer);
  });
  /** Asks again while any proposal is still queued or being drawn. */
  watch(data, (items) => {
    clearTimeout(timer);
    if (stopped || !items.some((p) => p.status === 'queued' || p.status === 'rendering')) return;
    timer = setTimeout(() => void reload(), PROPOSAL_POLL_MS);
  });

  const acting = ref(false);
  async function act<T>(run: () => Promise<T>): Promise<T> {
    acting.value = true;
    try {
      return await run();
    } finally {
      acting.value = false;
      void reload();
    }
  }

  /** Saves the PDF through the browser's download. */
  async function download(p: Proposal): Promise<void> {
    const { blob, filename } = await proposalsApi.pdf(p.projectId, p.id);
    downloadBlob(filename ?? 'proposal.pdf', blob);
  }

  return {
    proposals: data,
    busy,
    error,
    reload,
    acting,
    generate: (versionId: string) => act(() => proposalsApi.create(projectId.value, versionId)),
    send: (p: Proposal, to: string, message: string) =>
      act(() => proposalsApi.send(projectId.value, p.id, { to, message })),
    download,
  };
}
