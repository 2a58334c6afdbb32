"use client";
import useSWR from "swr";
import { fetchJson } from "@/features/ui/fetch-json";
import type { GasketChoiceDto } from "../model/dto";

export const GASKET_CHOICES_KEY = "/api/v1/library/gaskets";

async function fetchChoices(url: string): Promise<GasketChoiceDto[]> {
  return (await fetchJson<{ rows: GasketChoiceDto[] }>(url, "The Stockroom gaskets could not be loaded."))
    .rows;
}

/**
 * The gaskets a designer may pick: the built-in rows this organisation did not hide, plus its
 * own Stockroom rows (GET /api/v1/library/gaskets). Until the list arrives, or when it cannot be
 * loaded, the built-in rows stand in (`loaded` false) so the form never waits on the network:
 * `builtin` comes from the server page (features/editor/model/editor-choices.ts), so the client
 * bundle carries no gasket catalogue.
 */
export function useGasketChoices(
  builtin: GasketChoiceDto[],
  enabled = true,
): {
  rows: GasketChoiceDto[];
  loaded: boolean;
  error: string | null;
} {
  const { data, error } = useSWR(enabled ? GASKET_CHOICES_KEY : null, fetchChoices, {
    revalidateOnFocus: true,
    dedupingInterval: 10_000,
  });
  return { rows: data ?? builtin, loaded: !!data, error: error ? (error as Error).message : null };
}

/** The id of the choice a design's copied material came from ("org:…" kept; a catalogue id gets "builtin:"). */
export function choiceIdOfMaterial(catalogueId: string | undefined): string | null {
  if (!catalogueId) return null;
  return catalogueId.startsWith("org:") || catalogueId.startsWith("builtin:")
    ? catalogueId
    : `builtin:${catalogueId}`;
}
