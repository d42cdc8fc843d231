import { Router } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { manifestTemplateCsv } from './manifest-csv';
import { MANIFEST_CONFIRM_FIELD } from '@shared/schemas/manifest';
import { importManifest, ManifestRejectedError, previewManifest, templateFlight } from './manifest.service';
import { manifestUpload, uploadedText } from './manifest-upload';

const confirmBody = z.object({
  [MANIFEST_CONFIRM_FIELD]: z.enum(['true', 'false'], { error: `${MANIFEST_CONFIRM_FIELD} must be true or false` }).optional(),
});

const stationParams = z.object({ stationId: z.coerce.number().int().positive('stationId must be positive') });

/**
 * Mounted at /api/stations/:stationId/manifests, admins of the station only. The station check runs before the
 * upload is read, so nobody else's file is ever parsed.
 */
export function manifestsRouter(deps: { db: DataSource }) {
  const r = Router({ mergeParams: true });
  r.use(requireRole('admin'));
  r.use((req, res, next) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    res.locals.stationId = stationId;
    next();
  });

  r.get('/template', async (_req, res) => {
    const example = await templateFlight(deps.db, res.locals.stationId as number);
    res.type('text/csv; charset=utf-8').attachment('bumpboard-manifest-template.csv').send(manifestTemplateCsv(example));
  });

  r.post('/preview', manifestUpload, async (req, res) => {
    const { text } = uploadedText(req);
    res.json(await previewManifest(deps.db, res.locals.stationId as number, text));
  });

  r.post('/import', manifestUpload, async (req, res) => {
    const { text, fileName } = uploadedText(req);
    const { [MANIFEST_CONFIRM_FIELD]: confirm } = parse(confirmBody, req.body ?? {}, 'body');
    try {
      const result = await importManifest(deps.db, res.locals.stationId as number, text, currentUser(req), fileName, confirm === 'true');
      res.json(result);
    } catch (err) {
      if (!(err instanceof ManifestRejectedError)) throw err;
      res.status(400).json({ error: err.code, message: err.message, details: err.details, errors: err.problems });
    }
  });
  return r;
}
