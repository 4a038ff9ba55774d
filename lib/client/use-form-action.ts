"use client";

import { useRouter } from "next/navigation";
import { startTransition, useActionState, useEffect, useRef, type FormEvent } from "react";

/** What every server action built with `defineAction` answers. */
export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; message: string; fieldErrors: Record<string, string[]> };

export type ActionState<T> = ActionResult<T> | null;

/**
 * `useActionState` for a form, dispatched from `onSubmit` so React does not reset the inputs
 * when the action answers with field errors (a `<form action>` is reset after every submit).
 * With `refreshOnSuccess`, the server components of the page are re-read once per successful
 * answer (the action changed data they show).
 */
export function useFormAction<T>(
  action: (prev: ActionState<T>, formData: FormData) => Promise<ActionResult<T>>,
  options: { refreshOnSuccess?: boolean } = {},
) {
  const [state, dispatch, pending] = useActionState<ActionState<T>, FormData>(action, null);
  const router = useRouter();
  const refreshed = useRef<ActionState<T>>(null);
  const refreshOnSuccess = options.refreshOnSuccess ?? false;
  useEffect(() => {
    if (refreshOnSuccess && state?.ok && refreshed.current !== state) {
      refreshed.current = state;
      router.refresh();
    }
  }, [refreshOnSuccess, state, router]);
  function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget, (e.nativeEvent as SubmitEvent).submitter);
    startTransition(() => dispatch(fd));
  }
  const fieldErrors = state && !state.ok ? state.fieldErrors : {};
  // A message that only repeats a field's own error is already shown under that field.
  const repeated = state && !state.ok && Object.values(state.fieldErrors).some((msgs) => msgs.includes(state.message));
  const message = state && !state.ok && !repeated ? state.message : null;
  return { state, onSubmit, pending, fieldErrors, message };
}
