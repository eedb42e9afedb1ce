// How the workflow's actions and decisions read on screen: the lifecycle's words, our own icons,
// and which button weight each action gets.
import { lifecycle, type RequestAction, type SignOffDecision } from '@shared/domain/lifecycle';
import type { ButtonVariant } from '@/components/ui/button';
import type { IconName } from '@/components/ui/icon';
import type { Tone } from '@/theme';
import { lifecycleIcon } from './status';

export const actionLabel = (a: RequestAction) => lifecycle.actions[a].label;
export const actionIcon = (a: RequestAction): IconName => lifecycleIcon(lifecycle.actions[a].icon);

/** The actions that move a request forward; the others send it back or stop it. */
const forward: readonly RequestAction[] = ['submit', 'sign_review', 'approve', 'record_cut', 'accept_samples'];
export const isForward = (a: RequestAction) => forward.includes(a);

/**
 * The button for an action. `irreversible` only for the brand lead's approval of a change that
 * cannot be undone: that signature is the one that lets the factory cut.
 */
export function actionVariant(a: RequestAction, irreversible: boolean): ButtonVariant {
  if (a === 'approve' && irreversible) return 'irreversible';
  return isForward(a) ? 'primary' : 'secondary';
}

/** A sign-off's decision in one or two words, with an icon and a tone (never colour alone). */
export const decisionLook: Record<SignOffDecision, { word: string; icon: IconName; tone: Tone }> = {
  submitted: { word: 'Submitted', icon: 'arrow-right', tone: 'info' },
  reviewed: { word: 'Reviewed', icon: 'sign', tone: 'info' },
  returned: { word: 'Sent back', icon: 'returned', tone: 'due' },
  approved: { word: 'Approved', icon: 'done', tone: 'go' },
  declined: { word: 'Declined', icon: 'stop', tone: 'neutral' },
  received: { word: 'Cut sheet received', icon: 'check', tone: 'info' },
  cut_recorded: { word: 'Cut recorded', icon: 'cut', tone: 'info' },
  accepted: { word: 'Samples accepted', icon: 'done', tone: 'go' },
  rework: { word: 'Sent for rework', icon: 'tool', tone: 'due' },
  withdrawn: { word: 'Withdrawn', icon: 'archive', tone: 'neutral' },
};

/** What a finished action did, in words, for the confirmation after it. */
export const doneWords: Record<RequestAction, string> = {
  submit: 'Signed and submitted: the tooling engineer has been told.',
  sign_review: 'Review signed: the brand lead has been told.',
  return_to_draft: 'Sent back to the designer.',
  approve: 'Approved and signed: the factory may now cut.',
  return: 'Sent back.',
  decline: 'Declined: the tool stays as it is.',
  confirm_receipt: 'Receipt confirmed: the cut can be recorded once it is done.',
  record_cut: 'Cut recorded: the designer and the tooling engineer have been asked to check the first samples.',
  accept_samples: 'First samples accepted.',
  rework: 'Sent back for rework: the factory has been told.',
  withdraw: 'Withdrawn: the tool stays as it is.',
};
