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
}

/** The phone's step editor: a sheet with the step's form and Apply / Cancel in its footer. */
export function StepEditorSheet({ editing, onApply, onClose }: StepEditorSheetProps) {
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
          onApply={(step) => onApply(editing.index, step)}
          onCancel={onClose}
        />
      ) : null}
    </Sheet>
  );
}
