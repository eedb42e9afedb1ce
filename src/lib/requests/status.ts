// How a request's state reads on screen: the lifecycle's words, our own line icon and a tone.
// The lifecycle table names its icons in another set's style; they map to ours here.
import { lifecycle, type LifecycleIcon, type RequestState, type StateTone } from '@shared/domain/lifecycle';
import type { IconName } from '@/components/ui/icon';
import type { Tone } from '@/theme';

const iconOf: Record<LifecycleIcon, IconName> = {
  'pencil-outline': 'edit',
  'clipboard-search-outline': 'review',
  'account-tie-outline': 'person',
  'content-cut': 'cut',
  'eye-check-outline': 'eye-check',
  'check-circle-outline': 'done',
  'close-octagon-outline': 'stop',
  'archive-arrow-down-outline': 'archive',
  'send-outline': 'arrow-right',
  'file-sign': 'sign',
  'arrow-u-left-top': 'returned',
  'check-decagram-outline': 'done',
  'wrench-outline': 'tool',
};

/** Waiting for someone is neutral information, not a warning; amber stays for returned or due. */
const toneOf: Record<StateTone, Tone> = { working: 'neutral', waiting: 'info', go: 'go', done: 'go', stopped: 'neutral' };

export const lifecycleIcon = (icon: LifecycleIcon): IconName => iconOf[icon];

export function stateLook(s: RequestState): { label: string; icon: IconName; tone: Tone; description: string } {
  const rule = lifecycle.states[s];
  return { label: rule.label, icon: iconOf[rule.icon], tone: toneOf[rule.tone], description: rule.description };
}
