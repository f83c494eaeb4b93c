import type { MethodVersionSettings } from './api/methods.js';

type Data = Record<string, unknown>;

/** What the engine uses when neither the study nor its method version says otherwise. */
export const DEFAULT_ACCURACY_BETA = 0.8;
export const DEFAULT_ACCURACY_LAMBDA_PCT = 10;
export const DEFAULT_COVERAGE_FACTOR = 2;
type VersionOptions = Pick<MethodVersionSettings, 'accuracyBeta' | 'accuracyLambdaPct' | 'coverageFactor'>;

const isObject = (value: unknown): value is Data => typeof value === 'object' && value !== null && !Array.isArray(value);

/**
 * The accuracy-profile β and λ and the coverage factor k of the method version, for a study that
 * does not state its own: the study's options win. Only studies with accuracy results (or their own
 * uncertainty section) take them, so other studies keep their data unchanged.
 */
export function withVersionOptions<T extends Data>(data: T, settings: VersionOptions): T {
  if (!Array.isArray(data.accuracy) && !isObject(data.uncertainty)) return data;
  const out: Data = { ...data };
  if (Array.isArray(data.accuracy)) {
    const own = isObject(data.accuracyProfile) ? data.accuracyProfile : {};
    const profile: Data = {};
    if (settings.accuracyBeta !== undefined) profile.beta = settings.accuracyBeta;
    if (settings.accuracyLambdaPct !== undefined) profile.lambda = settings.accuracyLambdaPct;
    Object.assign(profile, own);
    if (Object.keys(profile).length > 0) out.accuracyProfile = profile;
  }
  if (settings.coverageFactor !== undefined) {
    const own = isObject(data.uncertainty) ? data.uncertainty : {};
    out.uncertainty = { coverageFactor: settings.coverageFactor, ...own };
  }
  return out as T;
}
