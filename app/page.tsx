import Link from "next/link";
import { FlangeIllustration } from "@/features/marketing/flange-illustration";
import { BrandMark } from "@/features/ui/brand-mark";
import { buttonStyles } from "@/features/ui/button-styles";
import { CautionPanel } from "@/features/ui/caution-panel";
import { getViewer } from "@/server/auth/guard";

const steps = [
  {
    title: "Lay out the bolts",
    text: "Draw the flange outline (circle, rectangle, obround or any polygon), put the gasket on it and place bolts along the bolt path: equally spaced in one step, or one by one where the nozzle or the hinge demands it.",
  },
  {
    title: "See the gasket stress between them",
    text: "Each bolt's clamp force spreads through the flange. Sealpitch estimates the stress along the whole gasket path at the lowest preload your tightening method can give, so a gap at mid-span shows up before the hydrotest does.",
  },
  {
    title: "Have it checked, hand it to the shop",
    text: "A second engineer reviews the seating margins and signs the revision off. The shop gets a bolt-spacing sheet with hole positions, pitch, tightening passes and every check, as PDF, CSV and DXF.",
  },
];

export default async function LandingPage() {
  const viewer = await getViewer();
  return (
    <div className="min-h-screen">
      <header className="border-b border-ink-100 bg-white">
        <div className="mx-auto flex max-w-6xl items-center justify-between px-gutter py-3">
          <Link href="/" className="flex items-center gap-2 font-semibold text-ink-900">
            <BrandMark /> Sealpitch
          </Link>
          <nav aria-label="Account" className="flex items-center gap-2">
            {viewer ? (
              <Link href="/desk" className={buttonStyles.primary}>
                Open your desk
              </Link>
            ) : (
              <>
                <Link href="/sign-in" className={buttonStyles.quiet}>
                  Sign in
                </Link>
                <Link href="/sign-up" className={buttonStyles.primary}>
                  Start an organisation
                </Link>
              </>
            )}
          </nav>
        </div>
      </header>

      <main>
        <section className="mx-auto grid max-w-6xl items-center gap-10 px-gutter py-16 md:grid-cols-[1.2fr_1fr]">
          <div>
            <p className="text-table font-medium uppercase tracking-wider text-brass-600">
              Gasketed flange tightness and bolt-pattern planning
            </p>
            <h1 className="mt-3 text-display font-semibold">
              Seat the gasket everywhere along its path, not just on average.
            </h1>
            <p className="mt-5 max-w-xl text-lead text-ink-700">
              Sealpitch is for piping and pressure-vessel engineers who choose bolt size, count and positions
              on standard pipe flanges and on the custom ones: channel covers, manways, rectangular hatches,
              full-face gasketed joints.
            </p>
            <div className="mt-8 flex flex-wrap gap-3">
              <Link href="/sign-up" className={buttonStyles.primary}>
                Start an organisation
              </Link>
              <Link href="/sign-in" className={buttonStyles.secondary}>
                Sign in to your team
              </Link>
            </div>
          </div>
          <div className="flex justify-center">
            <FlangeIllustration />
          </div>
        </section>

        <section aria-labelledby="how" className="border-y border-ink-100 bg-white">
          <div className="mx-auto max-w-6xl px-gutter py-14">
            <h2 id="how" className="text-heading font-semibold">
              From bolt circle to shop sheet
            </h2>
            <ol className="mt-8 grid gap-8 md:grid-cols-3">
              {steps.map((step, index) => (
                <li key={step.title}>
                  <span className="num text-lead text-brass-600">{String(index + 1).padStart(2, "0")}</span>
                  <h3 className="mt-1 text-lead font-semibold">{step.title}</h3>
                  <p className="mt-2 text-ink-700">{step.text}</p>
                </li>
              ))}
            </ol>
          </div>
        </section>

        <section
          aria-labelledby="methods"
          className="mx-auto grid max-w-6xl gap-10 px-gutter py-14 md:grid-cols-2"
        >
          <div>
            <h2 id="methods" className="text-heading font-semibold">
              Published methods, with their limits shown
            </h2>
            <p className="mt-3 text-ink-700">
              Bolt and clamped members are springs in series; each bolt&apos;s load spreads through the flange
              in a pressure cone or, for a soft gasket under a stiff flange, along the flange as a beam on an
              elastic foundation. ASME VIII-1 Appendix 2 bolt loads, gasket factors m and y, spacing rules and
              tightening scatter complete the picture, and every check names its source. Where a method stops
              (non-circular and full-face gaskets are outside Appendix 2), the result says so and labels the
              common-practice extension it used.
            </p>
          </div>
          <CautionPanel />
        </section>
      </main>

      <footer className="border-t border-ink-100 py-6 text-center text-table text-ink-500">
        Sealpitch · engineering estimates for gasketed bolted joints
      </footer>
    </div>
  );
}
