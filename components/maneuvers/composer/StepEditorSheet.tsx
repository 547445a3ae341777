import { useRef } from 'react';

import { Button } from '@/components/ui/Button';
import { Sheet } from '@/components/ui/Sheet';
import type { Primitive } from '@/shared/primitives/primitive-schemas';

import { StepEditor } from './StepEditor';

/** Props of {@link StepEditorSheet}. */
export interface StepEditorSheetProps {
  /** The step to edit, or null when the sheet is closed. */
  editing: { index: number; step: Primitive; isNew: boolean } | null;
  onApply: (index: number, step: Primitive) => void;
  onClose: () => void;
  /** The maneuver's crew member (joint ranges for a recorded sweep's plot). */
  crewMemberId?: string;
  /** A new recorded sweep's channels that were left out. */
  droppedChannels?: readonly string[];
}

/** The phone's step editor: a sheet with the step's form and Apply / Cancel in its footer. */
export function StepEditorSheet({ editing, onApply, onClose, crewMemberId, droppedChannels }: StepEditorSheetProps) {
  const submit = useRef<(() => void) | null>(null);
  return (
    <Sheet
      visible={!!editing}
      onClose={onClose}
      title={editing ? (editing.isNew ? `New step ${editing.index + 1}` : `Edit step ${editing.index + 1}`) : 'Step'}
      footer={
        <>
          <Button label="Cancel" variant="secondary" onPress={onClose} />
          <Button label={editing?.isNew ? 'Add step' : 'Apply step'} icon="check" onPress={() => submit.current?.()} />
        </>
      }
    >
      {editing ? (
        <StepEditor
          key={`${editing.index}-${editing.isNew}`}
          initial={editing.step}
          position={editing.index + 1}
          submitRef={submit}
          crewMemberId={crewMemberId}
          droppedChannels={editing.isNew ? droppedChannels : undefined}
          onApply={(step) => onApply(editing.index, step)}
          onCancel={onClose}
        />
      ) : null}
    </Sheet>
  );
}
