import { ManeuversScreen } from '@/components/maneuvers/ManeuversScreen';

/** `/maneuvers`: every sequence with its status, search and "new maneuver". */
export default function ManeuversIndex() {
  return <ManeuversScreen />;
}
