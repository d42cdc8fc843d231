// Manifest files go up as multipart form data, which the JSON client does not send; the CSRF token comes from the
// session the app already holds.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiErrorSchema } from '@shared/schemas/common';
import { MANIFEST_CONFIRM_FIELD, manifestImportResultSchema, manifestPreviewSchema, manifestRejectedSchema, type ManifestProblem } from '@shared/schemas/manifest';
import { sessionQueryOptions } from '../../../lib/session';
import { ApiRequestError } from '../../../lib/api-client';

export const manifestTemplateUrl = (stationId: number) => `/api/stations/${stationId}/manifests/template`;

/** A refused upload: the message, and for an import with problems, every problem with its line. */
export class ManifestUploadError extends ApiRequestError {
  constructor(status: number, body: { error: string; message: string; details?: { field: string; rule: string }[] }, readonly problems: ManifestProblem[] = []) {
    super(status, body);
  }
}

async function send(stationId: number, what: 'preview' | 'import', file: File, csrfToken: string, confirmRemovals = false): Promise<unknown> {
  const form = new FormData();
  // The server cancels stored passengers missing from the file only when this confirms the preview was read.
  if (confirmRemovals) form.append(MANIFEST_CONFIRM_FIELD, 'true');
  form.append('file', file, file.name);
  const res = await fetch(`/api/stations/${stationId}/manifests/${what}`, { method: 'POST', body: form, headers: { Accept: 'application/json', 'X-CSRF-Token': csrfToken }, credentials: 'same-origin' });
  const json: unknown = await res.json().catch(() => null);
  if (res.ok) return json;
  const rejected = manifestRejectedSchema.safeParse(json);
  if (rejected.success) throw new ManifestUploadError(res.status, rejected.data, rejected.data.errors);
  const plain = apiErrorSchema.safeParse(json);
  throw new ManifestUploadError(res.status, plain.success ? plain.data : { error: 'bad_response', message: `The server answered ${res.status}.` });
}

function useCsrfToken() {
  const qc = useQueryClient();
  return () => qc.getQueryData(sessionQueryOptions().queryKey)?.csrfToken ?? '';
}

export function usePreviewManifest(stationId: number) {
  const token = useCsrfToken();
  return useMutation({ mutationFn: async (file: File) => manifestPreviewSchema.parse(await send(stationId, 'preview', file, token())) });
}

export function useImportManifest(stationId: number) {
  const token = useCsrfToken();
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, confirmRemovals }: { file: File; confirmRemovals: boolean }) => manifestImportResultSchema.parse(await send(stationId, 'import', file, token(), confirmRemovals)),
    // The departures board and flight desks (their query roots) show booked counts: let them fetch fresh figures.
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: ['departures'] }), qc.invalidateQueries({ queryKey: ['flights'] })]),
  });
}
