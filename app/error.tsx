"use client";
import { ErrorNotice } from "@/features/ui/error-notice";

// The error boundary of every page below the root layout.
export default function PageError({
  error,
  reset,
}: {
  error: Error & { digest?: string };
  reset: () => void;
}) {
  return (
    <ErrorNotice
      title="This page could not be shown"
      text="Something failed while the page was prepared. What you had saved is kept; a change you had not yet saved on this page may need entering again. Try once more, or go back to your desk."
      digest={error.digest}
      reset={reset}
      back={{ href: "/desk", label: "Back to your desk" }}
    />
  );
}
