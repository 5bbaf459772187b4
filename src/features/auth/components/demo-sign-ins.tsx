import { DEMO_PASSWORD, DEMO_SIGN_INS } from './sign-in-schema';

/** The demo accounts as a hint list; picking one fills the form (it does not sign in by itself). */
export function DemoSignIns({ onPick }: { onPick: (email: string) => void }) {
  return (
    <section aria-labelledby="demo-sign-ins" className="rounded-md border border-stone-200 bg-stone-50 p-3">
      <h2 id="demo-sign-ins" className="text-xs font-semibold text-stone-700">
        Demo sign-ins
      </h2>
      <p className="mt-0.5 text-xs text-stone-600">
        Every demo person uses the password <code className="rounded bg-white px-1 font-mono">{DEMO_PASSWORD}</code>.
      </p>
      <ul className="mt-2 divide-y divide-stone-200">
        {DEMO_SIGN_INS.map((demo) => (
          <li key={demo.email}>
            <button
              type="button"
              onClick={() => onPick(demo.email)}
              className="flex w-full flex-wrap items-baseline justify-between gap-x-3 rounded px-1 py-1.5 text-left hover:bg-white"
            >
              <span className="font-mono text-xs text-spruce-800">{demo.email}</span>
              <span className="text-xs text-stone-600">
                {demo.role}: {demo.does}
              </span>
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
