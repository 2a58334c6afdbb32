"use client";

import { useRouter } from "next/navigation";
import { useActionState, useEffect } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { coverageText, rulesNeedingJustification } from "@/features/analysis/rule-groups";
import type { UnverifiedValue } from "@/features/analysis/unverified-values";
import type { ReviewCheck } from "../model/review-checks";
import { UnverifiedValueList } from "./unverified-value-list";
import type { RevisionPermissions } from "../review-dto";
import type { ReviewStatus } from "../model/review-states";

export interface TransitionSummaryView {
  designId: string;
  number: number;
  status: ReviewStatus;
  href: string;
}
export type ReviewTransitionAction = (
  previous: ActionResult<TransitionSummaryView> | null,
  formData: FormData,
) => Promise<ActionResult<TransitionSummaryView>>;

export interface DecisionActions {
  submitRevisionAction: ReviewTransitionAction;
  approveRevisionAction: ReviewTransitionAction;
  returnRevisionAction: ReviewTransitionAction;
  startNewRevisionAction: ReviewTransitionAction;
}

const fieldClass = "mt-1 block w-full rounded-plate border border-ink-200 bg-white p-1.5 text-body";

function RevisionRef({ designId, number }: { designId: string; number: number }) {
  return (
    <>
      <input type="hidden" name="designId" value={designId} />
      <input type="hidden" name="number" value={number} />
    </>
  );
}

/** What the viewer can do with this revision now: submit, approve, return or start the next one. */
export function DecisionPanel(props: {
  designId: string;
  number: number;
  version: number;
  status: ReviewStatus;
  checks: ReviewCheck[];
  unverifiedValues: UnverifiedValue[];
  permissions: RevisionPermissions;
  independenceNote: string | null;
  actions: DecisionActions;
}) {
  const router = useRouter();
  const [submitState, submitAction, submitting] = useActionState(props.actions.submitRevisionAction, null);
  const [approveState, approveAction, approving] = useActionState(props.actions.approveRevisionAction, null);
  const [returnState, returnAction, returning] = useActionState(props.actions.returnRevisionAction, null);
  const [newState, newAction, starting] = useActionState(props.actions.startNewRevisionAction, null);
  useEffect(() => {
    if (newState?.ok) router.push(newState.data.href);
  }, [newState, router]);

  const needing = rulesNeedingJustification(props.checks);
  const { canSubmit, canApprove, canReturn, canStartNew } = props.permissions;
  const fieldError = (state: ActionResult<unknown> | null, key: string) =>
    state && !state.ok ? state.fieldErrors?.[key]?.join(" ") : undefined;

  return (
    <section
      aria-labelledby="decision-heading"
      className="flex flex-col gap-4 rounded-plate bg-white p-panel shadow-plate"
    >
      <h2 id="decision-heading" className="text-lead font-semibold text-ink-900">
        Sign-off
      </h2>
      {!canSubmit && !canApprove && !canReturn && !canStartNew ? (
        <p className="text-body text-ink-600">
          {props.independenceNote ?? "Nothing for you to decide on this revision."}
        </p>
      ) : null}

      {canSubmit ? (
        <form action={submitAction} className="flex flex-col gap-2" aria-label="Submit for review">
          <RevisionRef designId={props.designId} number={props.number} />
          <input type="hidden" name="baseVersion" value={props.version} />
          <p className="text-table text-ink-700">
            Submitting freezes this revision: the server recomputes the result and records its content hash.
          </p>
          <button type="submit" className={buttonStyles.primary} disabled={submitting}>
            {props.status === "returned" ? "Resubmit for review" : "Submit for review"}
          </button>
          <FormStatus state={submitState} success="Submitted for review." />
        </form>
      ) : null}

      {canApprove ? (
        <form action={approveAction} className="flex flex-col gap-2" aria-label="Approve">
          <RevisionRef designId={props.designId} number={props.number} />
          {needing.length > 0 ? (
            <fieldset className="flex flex-col gap-2">
              <legend className="text-table font-semibold text-ink-800">
                {needing.length} rule{needing.length === 1 ? "" : "s"} warn or fail: write why each is
                acceptable (one justification covers every pair or bolt of its rule)
              </legend>
              {needing.map((r) => (
                <label key={r.rule} className="text-table text-ink-700" data-rule={r.rule}>
                  Justification for {r.title}
                  {coverageText(r) ? (
                    <span className="block text-micro text-ink-500">{coverageText(r)}</span>
                  ) : null}
                  <textarea
                    name={`justification:${r.rule}`}
                    required
                    rows={2}
                    maxLength={5000}
                    className={fieldClass}
                  />
                  {fieldError(approveState, `justifications.${r.rule}`) ? (
                    <span className="text-verdict-fail">
                      {fieldError(approveState, `justifications.${r.rule}`)}
                    </span>
                  ) : null}
                </label>
              ))}
            </fieldset>
          ) : (
            <p className="text-table text-ink-700">Every check passes or does not apply.</p>
          )}
          {props.unverifiedValues.length > 0 ? (
            <fieldset className="flex flex-col gap-2" aria-describedby="unverified-note">
              <legend className="text-table font-semibold text-ink-800">
                {props.unverifiedValues.length} unverified table value
                {props.unverifiedValues.length === 1 ? "" : "s"} in this result
              </legend>
              <p id="unverified-note" className="text-micro text-ink-500">
                Taken from memory and not checked against their tables. Check each against the edition in hand
                (or enter the maker&apos;s or the code&apos;s value and resubmit) before you approve.
              </p>
              <UnverifiedValueList values={props.unverifiedValues} label="Unverified table values" />
              <label className="flex items-start gap-2 text-table text-ink-800">
                <input type="checkbox" name="acknowledgeUnverifiedValues" value="on" className="mt-0.5" />
                <span>
                  I have read these {props.unverifiedValues.length} unverified values and accept them for this
                  approval
                </span>
              </label>
              {fieldError(approveState, "acknowledgeUnverifiedValues") ? (
                <span className="text-table text-verdict-fail">
                  {fieldError(approveState, "acknowledgeUnverifiedValues")}
                </span>
              ) : null}
            </fieldset>
          ) : null}
          <label className="text-table text-ink-700">
            Approval note (optional)
            <textarea name="comment" rows={2} maxLength={5000} className={fieldClass} />
          </label>
          <button type="submit" className={buttonStyles.primary} disabled={approving}>
            Approve revision
          </button>
          <FormStatus state={approveState} success="Approved." />
        </form>
      ) : null}

      {canReturn ? (
        <form
          action={returnAction}
          className="flex flex-col gap-2 border-t border-ink-100 pt-3"
          aria-label="Return to designer"
        >
          <RevisionRef designId={props.designId} number={props.number} />
          <label className="text-table text-ink-700">
            What needs to change
            <textarea name="comment" required rows={3} maxLength={5000} className={fieldClass} />
          </label>
          {fieldError(returnState, "comment") ? (
            <p className="text-table text-verdict-fail">{fieldError(returnState, "comment")}</p>
          ) : null}
          <button type="submit" className={buttonStyles.danger} disabled={returning}>
            Return to designer
          </button>
          <FormStatus state={returnState} success="Returned to the designer." />
        </form>
      ) : null}

      {canStartNew ? (
        <form action={newAction} className="flex flex-col gap-2" aria-label="Start a new revision">
          <RevisionRef designId={props.designId} number={props.number} />
          <button type="submit" className={buttonStyles.secondary} disabled={starting}>
            Start revision {props.number + 1}
          </button>
          <FormStatus state={newState} success="Revision started." />
        </form>
      ) : null}

      {props.independenceNote && (canSubmit || canStartNew) ? (
        <p className="text-micro text-ink-500">{props.independenceNote}</p>
      ) : null}
    </section>
  );
}
