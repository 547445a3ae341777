import { Button } from './Button';
import type { IconName } from './Icon';
import { Sheet, type SheetProps } from './Sheet';

/** The button that sends a form, as a form's frame draws it. */
export interface SubmitAction {
  label: string;
  icon?: IconName;
  /** The request is under way: the button spins and does not send twice. */
  pending: boolean;
  onPress: () => void;
}

/** Props of {@link FormSheet}. */
export interface FormSheetProps extends Omit<SheetProps, 'footer' | 'onClose'> {
  /** Cancel, the close button, the backdrop and Escape: the caller empties the form and closes the sheet. */
  onCancel: () => void;
  submit: SubmitAction;
}

/** A sheet that holds one form: the fields in the body, Cancel and the send button in the footer. */
export function FormSheet({ onCancel, submit, children, ...sheet }: FormSheetProps) {
  return (
    <Sheet
      {...sheet}
      onClose={onCancel}
      footer={
        <>
          <Button label="Cancel" variant="ghost" onPress={onCancel} />
          <Button label={submit.label} icon={submit.icon} loading={submit.pending} onPress={submit.onPress} />
        </>
      }
    >
      {children}
    </Sheet>
  );
}
