// The map's API, mounted at /api:
//   GET /api/map/features?speciesId&varietyId&status&farmId  farms and plants to draw
//   PUT /api/farms/:farmId/outline                            a farm's outline, beds and rows
// Each route carries its own guard: a router.use() guard on a router mounted at /api would
// answer 401 for every unknown /api path that passes through it.
import { Router } from 'express';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { plantListQuerySchema } from '../../../shared/schemas/register.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { route } from '../../lib/route.js';
import { forbidden } from '../../lib/http-error.js';
import { createFeaturesCache } from './features-cache.js';
import { mapFeatures, mayDrawOutline, saveOutline, type OutlineCollection } from './map.service.js';

export const mapFeaturesQuerySchema = plantListQuerySchema.pick({ speciesId: true, varietyId: true, status: true, farmId: true });

/** Most features one farm's drawing may hold, and points in one feature. */
export const MAX_OUTLINE_FEATURES = 500;
export const MAX_FEATURE_POINTS = 2_000;

// [longitude, latitude]; GeoJSON allows an altitude after them, which the map drops.
const position = z.tuple(
  [
    z.number({ error: 'A longitude must be a number' }).min(-180, 'Longitude is between -180 and 180').max(180, 'Longitude is between -180 and 180'),
    z.number({ error: 'A latitude must be a number' }).min(-90, 'Latitude is between -90 and 90').max(90, 'Latitude is between -90 and 90'),
  ],
  z.number(),
  { error: 'A position is [longitude, latitude]' },
);

// zod runs refinements even after a check failed, so these see rings that are too short or hold junk.
const samePosition = (p: unknown, q: unknown) => Array.isArray(p) && Array.isArray(q) && p[0] === q[0] && p[1] === q[1];

const ring = z
  .array(position)
  .min(4, 'A polygon ring has at least 4 positions (the last repeats the first)')
  .max(MAX_FEATURE_POINTS, `A shape has at most ${MAX_FEATURE_POINTS} points`)
  .refine((r) => r.length < 4 || samePosition(r[0], r[r.length - 1]), 'A polygon ring ends where it starts');

const geometry = z.discriminatedUnion(
  'type',
  [
    z.object({ type: z.literal('Polygon'), coordinates: z.array(ring).min(1, 'A polygon has an outer ring').max(50, 'A polygon has at most 50 rings') }),
    z.object({
      type: z.literal('LineString'),
      coordinates: z.array(position).min(2, 'A line has at least 2 positions').max(MAX_FEATURE_POINTS, `A line has at most ${MAX_FEATURE_POINTS} points`),
    }),
  ],
  { error: 'Each shape is a Polygon or a LineString' },
);

const feature = z
  .object({
    type: z.literal('Feature', { error: 'Each item is a GeoJSON Feature' }),
    id: z.union([z.string(), z.number()]).optional(),
    properties: z.object({
      kind: z.enum(['outline', 'bed', 'row'], { error: 'kind is outline, bed or row' }),
      label: z.string().trim().max(100, 'A label is at most 100 characters').optional(),
    }),
    geometry,
  })
  .refine((f) => f.properties?.kind !== 'outline' || f.geometry?.type === 'Polygon', {
    message: 'A farm outline is a closed shape (Polygon)',
    path: ['geometry'],
  });

export const outlineSchema = z.object({
  type: z.literal('FeatureCollection', { error: 'Send a GeoJSON FeatureCollection' }),
  features: z.array(feature).max(MAX_OUTLINE_FEATURES, `A farm's drawing has at most ${MAX_OUTLINE_FEATURES} shapes`),
});

const farmParams = z.object({ farmId: uuidParam });

export function mapRouter(ctx: AppContext): Router {
  const r = Router();
  const featuresCache = createFeaturesCache();
  r.get(
    '/map/features',
    requireActive(ctx),
    route({ query: mapFeaturesQuerySchema }, async ({ query }, req, res) => {
      const a = actorOf(req);
      const { body, etag } = await featuresCache.get(ctx.db, a, query, () => mapFeatures(ctx.db, a, query), req.dbState);
      // An ETag set here spares Express hashing 1.6 MB again; a browser holding it gets a 304.
      res.set('ETag', etag).type('json').send(body);
    }),
  );
  r.put(
    '/farms/:farmId/outline',
    requireActive(ctx),
    // Refuse people who may not draw here before looking at what they sent.
    (req, _res, next) => {
      if (!mayDrawOutline(actorOf(req), String(req.params.farmId))) {
        throw forbidden('Only the farm lead of this farm, or a coordinator, may draw its outline and beds.');
      }
      next();
    },
    route({ params: farmParams, body: outlineSchema }, ({ params, body }, req) => {
      // Keep only what the map uses: kind, label and the geometry (no stray properties stored).
      const clean: OutlineCollection = {
        type: 'FeatureCollection',
        features: body.features.map((f) => ({
          type: 'Feature',
          properties: { kind: f.properties.kind, ...(f.properties.label ? { label: f.properties.label } : {}) },
          geometry:
            f.geometry.type === 'Polygon'
              ? { type: 'Polygon', coordinates: f.geometry.coordinates.map((rg) => rg.map((p) => [p[0], p[1]] as [number, number])) }
              : { type: 'LineString', coordinates: f.geometry.coordinates.map((p) => [p[0], p[1]] as [number, number]) },
        })),
      };
      return saveOutline(ctx.db, actorOf(req), params.farmId, clean);
    }),
  );
  return r;
}
