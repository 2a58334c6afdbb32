"use client";

import { useActionState, useState } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import type { ReviewCheck } from "../model/review-checks";
import type { CommentDto } from "../review-dto";

export type AddCommentAction = (
  previous: ActionResult<CommentDto> | null,
  formData: FormData,
) => Promise<ActionResult<CommentDto>>;

/** The revision's comment thread. A comment pointing at a bolt or check highlights it when clicked. */
export function CommentThread(props: {
  designId: string;
  number: number;
  comments: CommentDto[];
  boltIds: string[];
  checks: ReviewCheck[];
  canComment: boolean;
  activeCommentId: string | null;
  onPickComment: (comment: CommentDto | null) => void;
  addCommentAction: AddCommentAction;
}) {
  const [state, formAction, pending] = useActionState(props.addCommentAction, null);
  const [target, setTarget] = useState("");
  const [kind, id] = target ? (target.split(/:(.*)/s) as [string, string]) : ["", ""];
  const checkTitles = new Map(props.checks.map((c) => [c.id, c.title]));

  return (
    <section aria-labelledby="comments-heading" className="flex flex-col gap-3">
      <h2 id="comments-heading" className="text-lead font-semibold text-ink-900">
        Comments
      </h2>
      {props.comments.length === 0 ? (
        <p className="text-body text-ink-500">No comments on this revision yet.</p>
      ) : null}
      <ol className="flex flex-col gap-2" aria-label="Comment thread">
        {props.comments.map((c) => {
          const active = c.id === props.activeCommentId;
          const label =
            c.targetKind === "bolt"
              ? `Bolt ${c.targetId}`
              : c.targetKind === "check"
                ? `Check: ${checkTitles.get(c.targetId ?? "") ?? c.targetId}`
                : null;
          return (
            <li
              key={c.id}
              data-testid="comment"
              className={`rounded-plate border p-2 ${active ? "border-brass-500 bg-brass-50" : "border-ink-100 bg-white"}`}
            >
              <p className="text-micro text-ink-500">
                <span className="font-medium text-ink-800">{c.authorName}</span> ·{" "}
                <time dateTime={c.at}>{c.at.slice(0, 16).replace("T", " ")}</time>
              </p>
              {label ? (
                <button
                  type="button"
                  aria-pressed={active}
                  className="mt-1 text-micro font-semibold text-brass-700 underline"
                  onClick={() => props.onPickComment(active ? null : c)}
                >
                  Show {label} on the drawing
                </button>
              ) : null}
              <p className="mt-1 whitespace-pre-wrap text-body text-ink-800">{c.body}</p>
            </li>
          );
        })}
      </ol>
      {props.canComment ? (
        <form action={formAction} className="flex flex-col gap-2" aria-label="Add a comment">
          <input type="hidden" name="designId" value={props.designId} />
          <input type="hidden" name="number" value={props.number} />
          <input type="hidden" name="targetKind" value={kind} />
          <input type="hidden" name="targetId" value={id} />
          <label className="text-table text-ink-700">
            Points at
            <select
              className="mt-1 block w-full rounded-plate border border-ink-200 bg-white p-1.5 text-body"
              value={target}
              onChange={(e) => setTarget(e.target.value)}
            >
              <option value="">The whole revision</option>
              <optgroup label="Bolts">
                {props.boltIds.map((b) => (
                  <option key={b} value={`bolt:${b}`}>
                    Bolt {b}
                  </option>
                ))}
              </optgroup>
              <optgroup label="Checks">
                {props.checks.map((c) => (
                  <option key={c.id} value={`check:${c.id}`}>
                    {c.title} ({c.id})
                  </option>
                ))}
              </optgroup>
            </select>
          </label>
          <label className="text-table text-ink-700">
            Comment
            <textarea
              name="body"
              required
              rows={3}
              maxLength={5000}
              className="mt-1 block w-full rounded-plate border border-ink-200 bg-white p-1.5 text-body"
            />
          </label>
          {state && !state.ok && state.fieldErrors ? (
            <p className="text-table text-verdict-fail">
              {Object.values(state.fieldErrors).flat().join(" ")}
            </p>
          ) : null}
          <button type="submit" className={buttonStyles.secondary} disabled={pending}>
            Post comment
          </button>
          <FormStatus state={state} success="Comment posted." />
        </form>
      ) : null}
    </section>
  );
}
