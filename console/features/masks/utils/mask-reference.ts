import type { MaskVersion } from '@shared/schemas/masks';

/** How the editor states what 0 dB means: relative to the curve at one frequency, or absolute. */
export type ReferenceChoice = { kind: 'at_frequency'; frequencyHz: string } | { kind: 'absolute' };

export const DEFAULT_REFERENCE: ReferenceChoice = { kind: 'at_frequency', frequencyHz: '1000' };

export function referenceChoiceOf(version: Pick<MaskVersion, 'levelReference' | 'referenceLevel'> | null): ReferenceChoice {
  if (!version || version.levelReference === 'absolute') return version ? { kind: 'absolute' } : DEFAULT_REFERENCE;
  return version.referenceLevel?.kind === 'at_frequency' ? { kind: 'at_frequency', frequencyHz: String(version.referenceLevel.frequencyHz) } : DEFAULT_REFERENCE;
}

/** The request members for a reference choice, or a message when the reference frequency is not usable. */
export function referenceContent(choice: ReferenceChoice):
  | { ok: true; content: { levelReference: 'absolute' } | { levelReference: 'relative'; referenceLevel: { kind: 'at_frequency'; frequencyHz: number } } }
  | { ok: false; error: string } {
  if (choice.kind === 'absolute') return { ok: true, content: { levelReference: 'absolute' } };
  const frequencyHz = Number(choice.frequencyHz.trim());
  if (choice.frequencyHz.trim() === '' || !Number.isFinite(frequencyHz) || frequencyHz < 20 || frequencyHz > 20_000) {
    return { ok: false, error: 'Use a number from 20 to 20000 Hz.' };
  }
  return { ok: true, content: { levelReference: 'relative', referenceLevel: { kind: 'at_frequency', frequencyHz } } };
}
