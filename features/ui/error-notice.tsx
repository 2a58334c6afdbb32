"use client";
import Link from "next/link";
import { buttonStyles } from "./button-styles";

/**
 * What app/error.tsx and app/global-error.tsx show: what happened, the error's digest as a
 * reference (the server log has the error under it), Try again and a way back. Never the error's
 * message or stack.
 */
export function ErrorNotice(props: {
  title: string;
  text: string;
  digest?: string;
  reset: () => void;
  back: { href: string; label: string };
}) {
  return (
    <main className="mx-auto max-w-xl px-gutter py-20">
      <p className="num text-table text-brass-600">Error</p>
      <h1 className="mt-1 text-heading font-semibold">{props.title}</h1>
      <p className="mt-3 text-ink-700">{props.text}</p>
      {props.digest && (
        <p className="mt-3 text-table text-ink-500">
          Reference for your administrator: <span className="num">{props.digest}</span>
        </p>
      )}
      <div className="mt-6 flex flex-wrap gap-3">
        <button type="button" className={buttonStyles.primary} onClick={props.reset}>
          Try again
        </button>
        <Link href={props.back.href} className={buttonStyles.secondary}>
          {props.back.label}
        </Link>
      </div>
    </main>
  );
}
