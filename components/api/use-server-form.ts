import type { UseMutationResult } from '@tanstack/react-query';
import { useState } from 'react';
import type { FieldValues, Path, UseFormReturn } from 'react-hook-form';

import { applyServerError } from './form-errors';

/** How {@link useServerForm} sends a react-hook-form form. */
export interface ServerFormOptions<TIn extends FieldValues, TOut, TReq, TRes> {
  /** The mutation that sends the form. */
  mutation: UseMutationResult<TRes, Error, TReq>;
  /** The request made of the checked values. */
  toRequest: (values: NoInfer<TOut>) => TReq;
  /** Fields the server may name in an error: that error shows beside the field, any other in the banner. */
  serverFields?: readonly Path<TIn>[];
  /** After the server accepted the form. */
  onSuccess: (result: TRes) => void;
  /** Empty the form once the server accepted it (a sheet opened again starts afresh). */
  resetOnSuccess?: boolean;
}

/**
 * Sends a react-hook-form form to the server: checks the fields, sends the request, shows a refusal beside its field
 * or in the form's banner, and keeps what the person typed on error.
 */
export function useServerForm<TIn extends FieldValues, TOut, TReq, TRes>(
  form: UseFormReturn<TIn, unknown, TOut>,
  { mutation, toRequest, serverFields = [], onSuccess, resetOnSuccess }: ServerFormOptions<TIn, TOut, TReq, TRes>,
) {
  const [formError, setFormError] = useState<string | null>(null);
  const send = form.handleSubmit((values) => {
    setFormError(null);
    mutation.mutate(toRequest(values), {
      onSuccess: (result) => {
        if (resetOnSuccess) form.reset();
        onSuccess(result);
      },
      onError: (err) => setFormError(applyServerError(err, serverFields, form.setError)),
    });
  });
  return {
    /** The banner's sentence: a refusal that names none of the form's fields, or null. */
    formError,
    pending: mutation.isPending,
    submit: () => void send(),
    /** Back to the default values, banner cleared (on Cancel). */
    reset: () => {
      form.reset();
      setFormError(null);
    },
  };
}
