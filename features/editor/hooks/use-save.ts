"use client";
import { useCallback, useEffect, useRef, useState } from "react";
import { useLatest } from "./use-latest";
import type { JointDesign } from "@/features/analysis/core/design";
import type { JointAnalysis, SaveWorkingRevisionAction } from "@/features/designs/workspace-contract";

export type SaveState = "saved" | "unsaved" | "saving" | "conflict" | "error";

export const AUTOSAVE_DELAY_MS = 2000;

interface SaveOptions {
  designId: string;
  initialVersion: number;
  initialDocument: JointDesign;
  document: JointDesign;
  meta: { name: string; equipmentTag: string };
  saveAction: SaveWorkingRevisionAction;
  /** Blocks saving (invalid fields, read-only, a drag in progress). */
  blocked: boolean;
  enabled: boolean;
  onSaved: (result: JointAnalysis, document: JointDesign) => void;
  /** Where the document's bolt pattern came from, when the Pattern finder applied it (sent with the save). */
  patternOriginOf?: (document: JointDesign) => { suggestion: number; of: number } | null;
}

/**
 * Saving without loss: every save sends the version it was based on; a refused (stale) save
 * keeps the local document untouched and stops autosave until the user decides. The document
 * that was last stored is tracked by reference, so undoing back to it reads as "Saved" again.
 */
export function useSave(o: SaveOptions) {
  const [version, setVersion] = useState(o.initialVersion);
  const [savedDoc, setSavedDoc] = useState(o.initialDocument);
  const [savedMeta, setSavedMeta] = useState(o.meta);
  const [state, setState] = useState<"idle" | "saving" | "conflict" | "error">("idle");
  const [message, setMessage] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]> | null>(null);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const inFlight = useRef(false);
  const versionRef = useRef(o.initialVersion);
  const latest = useLatest(o);

  const dirty =
    o.document !== savedDoc ||
    o.meta.name !== savedMeta.name ||
    o.meta.equipmentTag !== savedMeta.equipmentTag;

  const save = useCallback(async () => {
    const cur = latest.current;
    if (inFlight.current || cur.blocked || !cur.enabled) return;
    inFlight.current = true;
    setState("saving");
    const doc = cur.document;
    const meta = cur.meta;
    const patternOrigin = cur.patternOriginOf?.(doc) ?? null;
    try {
      const res = await cur.saveAction({
        designId: cur.designId,
        baseVersion: versionRef.current,
        document: doc,
        name: meta.name,
        equipmentTag: meta.equipmentTag,
        ...(patternOrigin ? { patternOrigin } : {}),
      });
      if (res.ok) {
        versionRef.current = res.data.version;
        setVersion(res.data.version);
        setSavedDoc(doc);
        setSavedMeta(meta);
        setSavedAt(res.data.savedAt);
        setMessage(null);
        setFieldErrors(null);
        setState("idle");
        cur.onSaved(res.data.result, doc);
      } else {
        setMessage(res.message);
        setFieldErrors(res.fieldErrors ?? null);
        setState(res.conflict ? "conflict" : "error");
      }
    } catch {
      setMessage("The save did not reach the server. Your edits are still here; try again.");
      setState("error");
    } finally {
      inFlight.current = false;
    }
  }, [latest]);

  // Autosave after a pause in editing; never during a conflict or while blocked.
  useEffect(() => {
    if (!dirty || state === "conflict" || state === "saving" || o.blocked || !o.enabled) return;
    const t = window.setTimeout(() => void save(), AUTOSAVE_DELAY_MS);
    return () => window.clearTimeout(t);
  }, [dirty, o.document, o.meta.name, o.meta.equipmentTag, state, o.blocked, o.enabled, save]);

  /** After "Reload theirs": adopt the server's document and version. */
  const adopt = useCallback((doc: JointDesign, v: number, meta: { name: string; equipmentTag: string }) => {
    versionRef.current = v;
    setVersion(v);
    setSavedDoc(doc);
    setSavedMeta(meta);
    setState("idle");
    setMessage(null);
    setFieldErrors(null);
  }, []);

  const saveState: SaveState =
    state === "saving"
      ? "saving"
      : state === "conflict"
        ? "conflict"
        : state === "error"
          ? "error"
          : dirty
            ? "unsaved"
            : "saved";
  return { save, adopt, saveState, dirty, version, message, fieldErrors, savedAt };
}
