/**
 * Every screen behind sign-in (and the two password forms), loaded as one chunk on web by
 * lazyScreen(). One chunk, not one per screen: Expo's web export moves every module that two lazy
 * chunks share (zod, forms, tables, charts…) into a common chunk that index.html loads up front,
 * which would put them back on the sign-in page. The 3D player stays a chunk of its own.
 */
export { AcceptInvitationForm } from '@/components/auth/AcceptInvitationForm';
export { ChangePasswordSheet } from '@/components/auth/ChangePasswordSheet';
export { CrewScreen } from '@/components/crew/CrewScreen';
export { SuitsScreen } from '@/components/crew/SuitsScreen';
export { UploadScreen } from '@/components/crew/UploadScreen';
export { ManeuversScreen } from '@/components/maneuvers/ManeuversScreen';
export { SequenceWorkspace } from '@/components/maneuvers/SequenceWorkspace';
export { RehearsalSession } from '@/components/rehearse/RehearsalSession';
export { RehearseScreen } from '@/components/rehearse/RehearseScreen';
export { ReviewQueueScreen } from '@/components/reviews/ReviewQueueScreen';
export { ReviewScreen } from '@/components/reviews/ReviewScreen';
export { TeamScreen } from '@/components/team/TeamScreen';
