import type { ChannelStats } from '@shared/dsp';
import type { Capture } from '@shared/schemas/captures';
import type { CaptureRow } from './captures.repo';

export function channelStatsColumn(stats: ChannelStats[]): Record<string, unknown>[] {
  return stats.map((channel, index) => ({
    index,
    peakDbfs: channel.peakDbfs,
    rmsDbfs: channel.rmsDbfs,
    dcOffset: channel.dcOffset,
    clippedSampleCount: channel.clippedSampleCount,
    flatTopRunCount: channel.flatTopRunCount,
  }));
}

export function presentCapture(row: CaptureRow): Capture {
  return {
    id: row.id,
    filename: row.filename,
    sha256: row.sha256,
    sizeBytes: row.sizeBytes,
    sampleRateHz: row.sampleRateHz,
    channelCount: row.channelCount,
    frameCount: row.frameCount,
    durationSeconds: row.durationSeconds,
    format: row.format,
    channels: row.channelStats as Capture['channels'],
    warnings: row.warnings as unknown as Capture['warnings'],
    createdAt: row.createdAt.toISOString(),
  };
}
