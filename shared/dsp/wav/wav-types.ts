/** How the samples are stored in the file. */
export type WavSampleEncoding = 'pcm_int' | 'float';

/** Header facts of a WAV file, known without decoding a sample. */
export interface WavInfo {
  sampleRateHz: number;
  channelCount: number;
  frameCount: number;
  durationSeconds: number;
  /** Container bits per sample (8, 16, 24, 32 or 64). */
  bitsPerSample: number;
  sampleEncoding: WavSampleEncoding;
  /** wFormatTag as found in the file: 1 (PCM), 3 (IEEE float) or 0xFFFE (WAVE_FORMAT_EXTENSIBLE). */
  formatTag: number;
  /** True when the fmt chunk is WAVE_FORMAT_EXTENSIBLE (the sub-format GUID then decides the encoding). */
  extensible: boolean;
  /**
   * True when the data chunk's size was the 0xFFFFFFFF placeholder of a streaming writer, so the samples were
   * taken to the end of the file (whole frames only); worth a note in the capture's metadata.
   */
  dataSizeFromFileLength: boolean;
}

/**
 * A decoded WAV: one Float64Array per channel, full scale = ±1. Integer samples are divided by exactly
 * 2^(bits−1) for both signs (AES17 full-scale convention), so the most negative code reads −1 and the most
 * positive (2^(bits−1)−1)/2^(bits−1).
 */
export interface DecodedWav extends WavInfo {
  channels: Float64Array[];
}

/** Sample encodings the writer produces. */
export type WavWriteEncoding = 'float32' | 'pcm24' | 'pcm16';

export interface WavWriteInput {
  sampleRateHz: number;
  /** One array per channel, all the same length, full scale = ±1. */
  channels: Float64Array[];
  encoding: WavWriteEncoding;
}
