"use client";
import { useEffect, useState } from "react";

export type EditorCore = typeof import("../model/editor-core");

// One request per page load, shared by every caller; the module stays once it has come.
let coreLoad: Promise<EditorCore> | null = null;

/** The browser's core (model/editor-core.ts), fetched on the first call. */
export function loadEditorCore(): Promise<EditorCore> {
  return (coreLoad ??= import("../model/editor-core"));
}

/**
 * The browser's core once it has arrived, null before: the Layout desk asks for it as soon as it
 * mounts. Null on the server and in the first render in the browser alike, so hydration matches.
 */
export function useEditorCore(): EditorCore | null {
  const [core, setCore] = useState<EditorCore | null>(null);
  useEffect(() => {
    let live = true;
    void loadEditorCore().then((m) => live && setCore(() => m));
    return () => {
      live = false;
    };
  }, []);
  return core;
}
