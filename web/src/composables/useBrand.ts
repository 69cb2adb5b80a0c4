import { onBeforeUnmount, ref } from 'vue';
import type { BrandUpdateInput } from '@basinwright/common';
import { brandApi } from '@/api/brand';
import type { Brand } from '@/api/types';
import { useResource } from '@/composables/useResource';

/** The firm brand page's data: the brand, its logo as an object URL, and the changes made to it. */
export function useBrand() {
  const logoUrl = ref<string | null>(null);
  const setLogo = (blob: Blob | null) => {
    if (logoUrl.value !== null) URL.revokeObjectURL(logoUrl.value);
    logoUrl.value = blob === null ? null : URL.createObjectURL(blob);
  };
  onBeforeUnmount(() => setLogo(null));

  async function loadLogo(brand: Brand, signal?: AbortSignal): Promise<void> {
    setLogo(brand.logo === null ? null : await brandApi.logo(256, signal));
  }

  const resource = useResource<Brand | null>(
    async (signal) => {
      const brand = await brandApi.get(signal);
      await loadLogo(brand, signal);
      return brand;
    },
    { initial: null, what: 'the firm brand' },
  );

  async function update(body: BrandUpdateInput): Promise<Brand> {
    const brand = await brandApi.update(body);
    resource.data.value = brand;
    return brand;
  }

  async function uploadLogo(file: File): Promise<Brand> {
    const brand = await brandApi.uploadLogo(file);
    resource.data.value = brand;
    await loadLogo(brand);
    return brand;
  }

  async function removeLogo(): Promise<void> {
    await brandApi.removeLogo();
    const current = resource.data.value;
    if (current !== null) resource.data.value = { ...current, logo: null };
    setLogo(null);
  }

  return { ...resource, brand: resource.data, logoUrl, update, uploadLogo, removeLogo };
}
