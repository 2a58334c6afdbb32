"use client";
import { useActionState, useState } from "react";
import { FLANGE_TEMPLATES } from "@/features/analysis/core/catalogue/flange-templates";
import { buttonStyles } from "@/features/ui/button-styles";
import { FieldFrame } from "@/features/ui/field-frame";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import type { ActionResult } from "@/features/forms/action-result";
import { METRIC_BOLT_SIZES } from "../model/template-defaults";
import { TEMPLATE_CHOICES, type TemplateField } from "../model/template-fields";
import type { TemplateKind } from "../model/templates";

/** A failed create returns what was typed, because React resets the form after the action. */
export type CreateDesignState =
  (ActionResult<{ designId: string }> & { values?: Record<string, string> }) | null;

const SUPPORTED_NPS = new Set(["2", "4", "6", "8", "10", "12", "16", "24"]);

function FieldInput({
  field,
  errors,
  defaultValue,
}: {
  field: TemplateField;
  errors?: string[];
  defaultValue: string;
}) {
  const id = `field-${field.name}`;
  const message = errors?.[0];
  const label = field.unit ? `${field.label} (${field.unit})` : field.label;
  if (field.input === "number") {
    return (
      <TextField
        label={label}
        name={field.name}
        errors={errors}
        hint={field.hint}
        defaultValue={defaultValue}
        inputMode="decimal"
        autoComplete="off"
      />
    );
  }
  const describedBy = message ? `${id}-error` : undefined;
  const control =
    field.input === "vertices" ? (
      <textarea
        id={id}
        name={field.name}
        rows={6}
        defaultValue={defaultValue}
        aria-invalid={message ? true : undefined}
        aria-describedby={describedBy}
        className="num rounded-plate border border-ink-200 bg-white px-3 py-2 text-table aria-[invalid=true]:border-verdict-fail"
      />
    ) : (
      <select
        id={id}
        name={field.name}
        defaultValue={defaultValue}
        aria-invalid={message ? true : undefined}
        aria-describedby={describedBy}
        className="rounded-plate border border-ink-200 bg-white px-3 py-2 text-body aria-[invalid=true]:border-verdict-fail"
      >
        {field.input === "bolt-size"
          ? METRIC_BOLT_SIZES.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))
          : FLANGE_TEMPLATES.filter((t) => SUPPORTED_NPS.has(t.nps)).map((t) => (
              <option
                key={t.id}
                value={t.id}
              >{`NPS ${t.nps} · Class ${t.pressureClass} · ${t.boltCount} × ${t.boltDesignation} in`}</option>
            ))}
      </select>
    );
  return (
    <FieldFrame id={id} label={label} message={message}>
      {control}
    </FieldFrame>
  );
}

/** Choose a template, fill its few dimensions, create; the server action redirects to the editor. */
export function NewDesignForm({
  createDesignAction,
  initialKind,
}: {
  createDesignAction: (state: CreateDesignState, formData: FormData) => Promise<CreateDesignState>;
  initialKind?: TemplateKind;
}) {
  const [state, formAction, pending] = useActionState(createDesignAction, null);
  const [kind, setKind] = useState<TemplateKind>(initialKind ?? "circular-flange");
  const values = state && !state.ok ? (state.values ?? {}) : {};
  const valuesKey = JSON.stringify(values);
  const choice = TEMPLATE_CHOICES.find((c) => c.kind === kind) ?? TEMPLATE_CHOICES[0];
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  // Messages for inputs this template does not show (should not happen; never hide one).
  const shown = new Set(["kind", "name", "equipmentTag", ...choice.fields.map((f) => f.name)]);
  const unplaced = Object.entries(errors)
    .filter(([key]) => !shown.has(key))
    .map(([key, list]) => `${key}: ${list[0]}`);
  return (
    <form action={formAction} className="flex flex-col gap-6" noValidate>
      {/* React resets a form after its action, which would snap the radios back to their first
          rendering; the chosen template is therefore sent from state, and the group remounts. */}
      <input type="hidden" name="kind" value={kind} />
      <fieldset key={`kind${valuesKey}`} className="flex flex-col gap-2">
        <legend className="mb-2 text-lead font-semibold">Template</legend>
        <div className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
          {TEMPLATE_CHOICES.map((c) => (
            <label
              key={c.kind}
              className="flex cursor-pointer gap-2 rounded-plate border border-ink-200 bg-white p-3 has-[:checked]:border-brass-500 has-[:checked]:bg-brass-50"
            >
              <input
                type="radio"
                name="templateChoice"
                value={c.kind}
                checked={kind === c.kind}
                onChange={() => setKind(c.kind)}
              />
              <span>
                <span className="block font-medium text-ink-900">{c.label}</span>
                <span className="block text-table text-ink-600">{c.description}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.kind ? <p className="text-table text-verdict-fail">{errors.kind[0]}</p> : null}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        {(
          [
            ["name", "Name", "Channel cover, E-2107"],
            ["equipmentTag", "Equipment tag", "E-2107"],
          ] as const
        ).map(([name, label, placeholder]) => (
          <TextField
            key={`${name}${valuesKey}`}
            label={label}
            name={name}
            errors={errors[name]}
            defaultValue={values[name] ?? ""}
            placeholder={placeholder}
            autoComplete="off"
          />
        ))}
      </div>
      <fieldset key={`${choice.kind}${valuesKey}`} className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 text-lead font-semibold">{choice.label}: dimensions</legend>
        {choice.fields.map((f) => (
          <FieldInput
            key={f.name}
            field={f}
            errors={errors[f.name]}
            defaultValue={values.kind === choice.kind ? (values[f.name] ?? f.defaultValue) : f.defaultValue}
          />
        ))}
      </fieldset>
      <div className="flex items-center gap-4">
        <button type="submit" className={buttonStyles.primary} disabled={pending}>
          {pending ? "Creating…" : "Create design"}
        </button>
        <FormStatus state={state} />
        {unplaced.length > 0 ? <p className="text-table text-verdict-fail">{unplaced.join("; ")}</p> : null}
      </div>
    </form>
  );
}
