import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient, buildApiUrl } from '@console/lib/api-client';
import type { Page } from '@shared/schemas/pagination';
import type { Stimulus } from '@shared/schemas/stimuli';
import { stimulusKeys } from './keys';

export const STIMULI_PAGE_SIZE = 20;

export const getStimuli = ({ limit, cursor }: { limit: number; cursor?: string }) =>
  apiClient.get<Page<Stimulus>>('/stimuli', { query: { limit, cursor } });

export const getStimuliQueryOptions = (limit = STIMULI_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: stimulusKeys.list({ limit }),
    queryFn: ({ pageParam }) => getStimuli({ limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
  });

export const useStimuli = (limit?: number) => useInfiniteQuery(getStimuliQueryOptions(limit));

export type StimulusEncoding = 'float32' | 'pcm24';

/** A same-origin link: the browser sends the session cookie and saves the file under the server's name. */
export const stimulusAudioHref = (stimulusId: string, encoding: StimulusEncoding) =>
  buildApiUrl(`/stimuli/${encodeURIComponent(stimulusId)}/audio`, { encoding });
