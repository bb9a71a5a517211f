import { Button, buttonClasses } from '@console/components/ui/button';
import { Dialog } from '@console/components/ui/dialog';
import type { Stimulus } from '@shared/schemas/stimuli';
import { stimulusAudioHref } from '../api/get-stimuli';
import { STIMULUS_TYPE_LABELS } from '../utils/stimulus-fields';
import { stimulusLength, stimulusLevel, stimulusRange, stimulusTitle } from '../utils/stimulus-display';
import { StimulusCautions } from './stimulus-cautions';

type StimulusDownloadDialogProps = { stimulus: Stimulus | null; justCreated?: boolean; onClose: () => void };

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="space-y-0.5">
      <dt className="font-mono text-eyebrow font-semibold text-ink-600 uppercase">{label}</dt>
      <dd className="text-sm text-ink-900">{value}</dd>
    </div>
  );
}

/** The WAV downloads of one stimulus, with its safety cautions right above the links. */
export function StimulusDownloadDialog({ stimulus, justCreated, onClose }: StimulusDownloadDialogProps) {
  return (
    <Dialog
      open={stimulus !== null}
      onClose={onClose}
      className="w-[min(44rem,calc(100vw-2rem))]"
      title={stimulus ? stimulusTitle(stimulus) : 'Stimulus'}
      description={
        stimulus && (
          <p>
            {justCreated ? 'Created. ' : ''}
            {STIMULUS_TYPE_LABELS[stimulus.type]} · <span className="font-mono text-xs">{stimulus.id}</span>
          </p>
        )
      }
      footer={
        <Button variant="secondary" onClick={onClose}>
          Close
        </Button>
      }
    >
      {stimulus && (
        <div className="space-y-4">
          <dl className="grid grid-cols-2 gap-4 sm:grid-cols-3">
            <Figure label="Covers" value={stimulusRange(stimulus)} />
            <Figure label="Peak level" value={stimulusLevel(stimulus)} />
            <Figure label="Length" value={stimulusLength(stimulus)} />
          </dl>
          <StimulusCautions cautions={stimulus.cautions} />
          <div className="space-y-2">
            <p className="text-sm font-semibold text-ink-800">Download the WAV (mono, regenerated bit for bit from its parameters)</p>
            <div className="flex flex-wrap gap-2">
              <a href={stimulusAudioHref(stimulus.id, 'float32')} download className={buttonClasses('primary', 'sm')}>
                WAV, 32-bit float
              </a>
              <a href={stimulusAudioHref(stimulus.id, 'pcm24')} download className={buttonClasses('secondary', 'sm')}>
                WAV, 24-bit PCM
              </a>
            </div>
            <p className="text-xs text-ink-600">
              Record the device under test playing exactly this file: analyses regenerate the stimulus from the same
              parameters to deconvolve the capture.
            </p>
          </div>
        </div>
      )}
    </Dialog>
  );
}
