// SWR keys and cache tags of the review feature (neutral module: imported by server and client).
export const DESK_LISTS_KEY = "/api/v1/desk";

export const revisionPath = (designId: string, number: number): string =>
  `/designs/${designId}/revisions/${number}`;
export const comparePath = (designId: string, from: number, to: number): string =>
  `/designs/${designId}/compare?from=${from}&to=${to}`;
