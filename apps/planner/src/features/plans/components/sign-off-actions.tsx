import { useId, useState } from 'react';
import type { PlanAction, PlanDetail, PlanSummary, Role } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { returnTransitionSchema, useTransitionPlan } from '../api/transition-plan';
import { actionAvailability, planActions } from '../sign-off-rules';

const buttonWords: Record<PlanAction, { label: string; busy: string; done: string }> = {
  submit: { label: 'Submit for sign-off', busy: 'Submitting…', done: 'Submitted for sign-off; the supervisors have been told by e-mail.' },
  approve: { label: 'Approve', busy: 'Approving…', done: 'Approved; the planner has been told by e-mail.' },
  return: { label: 'Return to planner', busy: 'Returning…', done: 'Returned to the planner with your comment.' },
  release: { label: 'Release to the floor', busy: 'Releasing…', done: 'Released; the floor leads have been told by e-mail.' },
};

/**
 * Sign-off buttons for the signed-in person, shown only where the API's state machine allows
 * them. Returning a plan needs a comment; approving may carry one.
 */
export function SignOffActions({ plan, role, onDone }: { plan: PlanSummary | PlanDetail; role: Role; onDone?: (action: PlanAction) => void }) {
  const transition = useTransitionPlan();
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | null>(null);
  const [done, setDone] = useState<PlanAction | null>(null);
  const commentId = useId();

  const offered = planActions.map((action) => ({ action, availability: actionAvailability(action, plan.state, role, plan.solveStatus) }));
  const visible = offered.filter((o) => o.availability.outcome !== 'hidden');
  const wantsComment = visible.some((o) => o.action === 'return' || o.action === 'approve');

  if (visible.length === 0) {
    return done ? (
      <p role="status" className="text-fine-700">
        <span aria-hidden="true">✓ </span>
        {buttonWords[done].done}
      </p>
    ) : null;
  }

  const run = (action: PlanAction) => {
    setCommentError(null);
    setDone(null);
    if (action === 'return') {
      const parsed = returnTransitionSchema.safeParse({ comment });
      if (!parsed.success) {
        setCommentError(parsed.error.issues[0]?.message ?? 'Say why the plan goes back to the planner.');
        document.getElementById(commentId)?.focus();
        return;
      }
    }
    transition.mutate(
      { planId: plan.id, action, comment: comment.trim() || undefined },
      {
        onSuccess: () => {
          setDone(action);
          setComment('');
          onDone?.(action);
        },
      },
    );
  };

  return (
    <section aria-label="Sign-off" className="flex flex-col gap-3 rounded border border-line bg-panel p-3">
      <h2 className="font-semibold">Sign-off</h2>
      {wantsComment ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={commentId} className="text-sm font-semibold">
            Comment (required to return)
          </label>
          <textarea
            id={commentId}
            value={comment}
            onChange={(e) => {
              setComment(e.target.value);
              if (commentError) setCommentError(null);
            }}
            rows={3}
            maxLength={2000}
            aria-invalid={commentError ? true : undefined}
            aria-describedby={commentError ? `${commentId}-error` : undefined}
            className="rounded border border-line bg-panel px-2 py-1.5 aria-[invalid=true]:border-fault-700"
          />
          {commentError ? (
            <p id={`${commentId}-error`} className="text-sm text-fault-700">
              <span aria-hidden="true">✕ </span>
              {commentError}
            </p>
          ) : null}
        </div>
      ) : null}
      <div className="flex flex-wrap items-center gap-2">
        {visible.map(({ action, availability }) => (
          <Button
            key={action}
            variant={action === 'return' ? 'danger' : 'primary'}
            busy={transition.isPending && transition.variables?.action === action}
            busyLabel={buttonWords[action].busy}
            disabled={availability.outcome === 'blocked' || transition.isPending}
            aria-describedby={availability.outcome === 'blocked' ? `${commentId}-${action}-why` : undefined}
            onClick={() => run(action)}
          >
            {buttonWords[action].label}
          </Button>
        ))}
      </div>
      {visible.map(({ action, availability }) =>
        availability.outcome === 'blocked' ? (
          <p key={action} id={`${commentId}-${action}-why`} className="text-sm text-ink-soft">
            {availability.reason}
          </p>
        ) : null,
      )}
      {transition.isError ? <ErrorState error={transition.error} title="Not done" /> : null}
      {done ? (
        <p role="status" className="text-fine-700">
          <span aria-hidden="true">✓ </span>
          {buttonWords[done].done}
        </p>
      ) : null}
    </section>
  );
}
