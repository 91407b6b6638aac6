import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, type UploadOptions } from '@/lib/api-client';
import type { ImportPreviewDto, ImportResultDto } from '@shared/schemas/library';
import { libraryMaterialKeys, librarySetKeys, referenceKeys } from './keys';

function formWith(file: File): FormData {
  const form = new FormData();
  form.append('file', file, file.name);
  return form;
}

/** Checks every row of a CSV file on the server; nothing is written. */
export const previewImport = (file: File, options: UploadOptions) => api.upload<ImportPreviewDto>('/library/import/preview', formWith(file), options);

export const TEMPLATE_URL = '/api/library/import/template.csv';

/** Imports every row as drafts in one transaction (all or nothing). */
export function useImportAll() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, ...options }: { file: File } & UploadOptions) => api.upload<ImportResultDto>('/library/import', formWith(file), options),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: librarySetKeys.all });
      void qc.invalidateQueries({ queryKey: libraryMaterialKeys.all });
      void qc.invalidateQueries({ queryKey: referenceKeys.all });
    },
  });
}
