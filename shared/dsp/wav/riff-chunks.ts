import { EngineError } from '../errors';

/**
 * RIFF chunk walk (Microsoft/IBM "Multimedia Programming Interface and Data Specifications 1.0", 1991, ch. 2:
 * a chunk is a four-character id, a little-endian uint32 size and `size` bytes of data, followed by one pad byte
 * when the size is odd). Unknown chunks (LIST, fact, bext, JUNK, cue, ...) are skipped wherever they appear.
 */
export interface ChunkLocation {
  /** Offset of the chunk's data (after its 8-byte header). */
  offset: number;
  /** Data size in bytes, as declared (or as available, see `sizeFromFileLength`). */
  size: number;
  /** True when the declared size was the 0xFFFFFFFF placeholder of a streaming writer and the file length was used. */
  sizeFromFileLength: boolean;
}

export interface WaveChunks {
  fmt: ChunkLocation;
  data: ChunkLocation;
}

/** Size placeholder that streaming writers leave in RIFF and data headers they never rewrite. */
export const STREAMING_SIZE_PLACEHOLDER = 0xffffffff;

function fourCc(bytes: Uint8Array, offset: number): string {
  return String.fromCharCode(bytes[offset], bytes[offset + 1], bytes[offset + 2], bytes[offset + 3]);
}

/** Little-endian uint32 at `offset`. */
export function readUint32(bytes: Uint8Array, offset: number): number {
  return (bytes[offset] | (bytes[offset + 1] << 8) | (bytes[offset + 2] << 16) | (bytes[offset + 3] << 24)) >>> 0;
}

/** Little-endian uint16 at `offset`. */
export function readUint16(bytes: Uint8Array, offset: number): number {
  return bytes[offset] | (bytes[offset + 1] << 8);
}

function requireRiffWave(bytes: Uint8Array): void {
  if (bytes.length >= 4 && fourCc(bytes, 0) === 'RF64') {
    throw new EngineError(
      'wav_rf64_unsupported',
      'This is an RF64 (64-bit RIFF) file, which is not supported. Save the capture as a standard RIFF WAVE (under 4 GiB).',
    );
  }
  if (bytes.length >= 4 && fourCc(bytes, 0) === 'RIFX') {
    throw new EngineError('wav_rifx_unsupported', 'This is a big-endian RIFX file, which is not supported. Save it as little-endian RIFF WAVE.');
  }
  if (bytes.length < 12 || fourCc(bytes, 0) !== 'RIFF' || fourCc(bytes, 8) !== 'WAVE') {
    throw new EngineError('wav_not_riff', 'Not a WAV file: it must start with a RIFF header of form type "WAVE".', {
      details: { fileBytes: bytes.length },
    });
  }
}

function duplicateChunk(id: string): EngineError {
  return new EngineError('wav_duplicate_chunk', `The file has more than one "${id.trim()}" chunk; a WAVE file has exactly one.`, {
    details: { chunk: id.trim() },
  });
}

/** Locate the fmt and data chunks; throws EngineError wav_* for a malformed container. */
export function findWaveChunks(bytes: Uint8Array): WaveChunks {
  requireRiffWave(bytes);
  const declaredRiffSize = readUint32(bytes, 4);
  // The RIFF size is only a hint: writers get it wrong (or leave a streaming placeholder), and every chunk is
  // checked against the real file length anyway. Past the declared form end, reading stops once fmt and data
  // are found, so trailing bytes after the form are ignored.
  const formEnd = 8 + declaredRiffSize;
  let fmt: ChunkLocation | undefined;
  let data: ChunkLocation | undefined;
  let position = 12;
  while (position + 8 <= bytes.length) {
    if (position >= formEnd && fmt && data) break;
    const id = fourCc(bytes, position);
    const declaredSize = readUint32(bytes, position + 4);
    const offset = position + 8;
    const available = bytes.length - offset;
    if (id === 'data') {
      if (data) throw duplicateChunk(id);
      if (declaredSize === STREAMING_SIZE_PLACEHOLDER) {
        data = { offset, size: available, sizeFromFileLength: true };
        break;
      }
      if (declaredSize > available) {
        throw new EngineError(
          'wav_truncated',
          `The data chunk declares ${declaredSize} bytes but only ${available} remain in the file: the file is truncated.`,
          { details: { declaredBytes: declaredSize, availableBytes: available } },
        );
      }
      data = { offset, size: declaredSize, sizeFromFileLength: false };
    } else if (id === 'fmt ') {
      if (fmt) throw duplicateChunk(id);
      if (declaredSize > available) {
        throw new EngineError('wav_truncated', `The fmt chunk declares ${declaredSize} bytes but only ${available} remain: the file is truncated.`, {
          details: { declaredBytes: declaredSize, availableBytes: available },
        });
      }
      fmt = { offset, size: declaredSize, sizeFromFileLength: false };
    } else if (declaredSize > available) {
      // A metadata chunk cut short at the end of the file: nothing after it can be read.
      break;
    }
    // Odd-sized chunks are followed by a pad byte that is not counted in the size.
    position = offset + declaredSize + (declaredSize & 1);
  }
  if (!fmt) throw new EngineError('wav_missing_fmt', 'The WAV file has no "fmt " chunk, so its sample format is unknown.');
  if (!data) throw new EngineError('wav_missing_data', 'The WAV file has no "data" chunk: it contains no samples.');
  return { fmt, data };
}
