"use client";
import { ErrorNotice } from "@/features/ui/error-notice";
import "./globals.css";

// Replaces the root layout when the layout itself fails, so it brings its own <html> and <body>
// (and no app fonts: the system sans stands in).
export default function GlobalError({
  error,
  reset,
}: {
  error: Error & { digest?: string };
  reset: () => void;
}) {
  return (
    <html lang="en">
      <body className="min-h-screen">
        <ErrorNotice
          title="Sealpitch could not show this page"
          text="Something failed before the page could be laid out. What you had saved is kept. Try once more; if it keeps failing, tell your administrator."
          digest={error.digest}
          reset={reset}
          back={{ href: "/", label: "Sealpitch home" }}
        />
      </body>
    </html>
  );
}
