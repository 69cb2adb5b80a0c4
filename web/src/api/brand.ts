import type { BrandUpdateInput } from '@basinwright/common';
import { request, requestBlob } from './client';
import type { Brand } from './types';

export const brandApi = {
  get: (signal?: AbortSignal) => request<Brand>('/firm/brand', { signal }),
  update: (body: BrandUpdateInput) => request<Brand>('/firm/brand', { method: 'PUT', body }),
  uploadLogo: (file: File) => {
    const form = new FormData();
    form.append('logo', file, file.name);
    return request<Brand>('/firm/brand/logo', { method: 'PUT', form });
  },
  removeLogo: () => request<void>('/firm/brand/logo', { method: 'DELETE' }),
  logo: (size: 64 | 128 | 256 | 512, signal?: AbortSignal) =>
    requestBlob('/firm/brand/logo', { query: { size }, signal }),
};
