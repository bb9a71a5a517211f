import { describe, expect, it } from 'vitest';
import { originalOctaveFraction, rerunInput } from './rerun-options';

// The re-run contract of POST /v1/analyses/{id}/rerun (shared/schemas/analyses.ts: members given replace the
// original's); no external source.
describe('re-run request', () => {
  it('changes only the smoothing and keeps the other options', () => {
    const analysis = { kind: 'frequency_response' as const, request: { options: { smoothing: { octaveFraction: 6, averaging: 'power' }, grid: { pointsPerOctave: 24 } } } };
    expect(rerunInput(analysis, { octaveFraction: 24 })).toEqual({ options: { smoothing: { octaveFraction: 24, averaging: 'power' }, grid: { pointsPerOctave: 24 } } });
    expect(originalOctaveFraction(analysis)).toBe(6);
  });

  it('puts smoothing under response and orders under distortion for the combined kind', () => {
    const analysis = { kind: 'response_and_distortion' as const, request: { options: { distortion: { thdHeadline: 'thd_r' } } } };
    expect(rerunInput(analysis, { octaveFraction: 'none', maxOrder: 7 })).toEqual({
      options: { response: { smoothing: { octaveFraction: 'none' } }, distortion: { thdHeadline: 'thd_r', maxOrder: 7 } },
    });
  });

  it('copies the conditions with the new gate, in seconds, or without one', () => {
    const analysis = { kind: 'frequency_response' as const, request: { conditions: { distanceM: 1, environment: 'gated' as const, gate: { lengthSeconds: 0.005 } } } };
    expect(rerunInput(analysis, { gateMs: 3.5 }).conditions).toEqual({ distanceM: 1, environment: 'gated', gate: { lengthSeconds: 0.0035 } });
    expect(rerunInput(analysis, { gateMs: null }).conditions).toEqual({ distanceM: 1 });
  });
});
