import type * as React from 'react';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import type { DomainIssue } from '@/shared/domain/domain-error';
import { describePath } from '../lib/describe-path';
import { fmt2 } from '../lib/units';
import { formatNumber } from '@/shared/format';

export type Figure = {
  label: string;
  value: number | null | undefined;
  unit: string;
  strong?: boolean;
  whole?: boolean;
  decimals?: number;
};

function show(f: Figure): string {
  if (typeof f.value !== 'number' || !Number.isFinite(f.value)) return fmt2(f.value);
  if (f.whole) return formatNumber(f.value, 0);
  if (f.decimals !== undefined) return formatNumber(f.value, f.decimals);
  return fmt2(f.value);
}

/** The headline numbers, always with their units. */
export function Figures({ figures }: { figures: readonly Figure[] }) {
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
      {figures.map((f) => (
        <div key={f.label} className="rounded-md bg-stone-50 px-3 py-2">
          <dt className="text-xs text-stone-600">{f.label}</dt>
          <dd className={f.strong ? 'num text-lg font-semibold text-spruce-800' : 'num text-base text-stone-900'}>
            {show(f)} <span className="text-xs font-normal text-stone-600">{f.unit}</span>
          </dd>
        </div>
      ))}
    </dl>
  );
}

/** What is wrong with the inputs, each with the field it is in. */
export function IssueList({
  issues,
  describe,
}: {
  issues: readonly DomainIssue[];
  describe?: (path: string) => string;
}) {
  if (issues.length === 0) return null;
  return (
    <div role="alert" className="rounded-md border border-brick-200 bg-brick-50 px-3 py-2 text-sm text-brick-800">
      <p className="font-medium">No result until these are fixed:</p>
      <ul className="mt-1 list-disc pl-5">
        {issues.slice(0, 12).map((i) => (
          <li key={`${i.path}:${i.message}`}>
            {i.path && i.path !== '(body)' ? (
              <span className="font-medium">{(describe ?? describePath)(i.path)}: </span>
            ) : null}
            {i.message}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** The engine's calculation trail, step by step, for a reviewer. */
export function Trail({ steps }: { steps: readonly string[] }) {
  return (
    <details open className="group">
      <summary className="cursor-pointer text-xs font-semibold text-stone-700">
        How it was worked ({steps.length} steps)
      </summary>
      <ol className="mt-2 list-decimal space-y-1 pl-5 text-xs leading-relaxed text-stone-700 tabular-nums">
        {steps.map((step, i) => (
          <li key={i}>{step}</li>
        ))}
      </ol>
    </details>
  );
}

/** The result card: figures, the picture, and the trail; or the issues that stop a result. */
export function ResultPanel(props: {
  title?: string;
  issues: readonly DomainIssue[];
  describe?: (path: string) => string;
  figures?: readonly Figure[];
  picture?: React.ReactNode;
  trail?: readonly string[];
  children?: React.ReactNode;
}) {
  const ok = props.issues.length === 0 && props.figures;
  return (
    <Card aria-label="Result" aria-live="polite">
      <CardHeader>
        <CardTitle>{props.title ?? 'Result'}</CardTitle>
        <span className="text-xs text-stone-500">Updates as you type</span>
      </CardHeader>
      <CardBody className="space-y-4">
        <IssueList issues={props.issues} {...(props.describe ? { describe: props.describe } : {})} />
        {!ok && props.issues.length === 0 ? (
          <p className="text-sm text-stone-600">No result yet: see the problems listed with the inputs.</p>
        ) : null}
        {ok ? <Figures figures={props.figures!} /> : null}
        {ok ? props.picture : null}
        {ok ? props.children : null}
        {ok && props.trail ? <Trail steps={props.trail} /> : null}
      </CardBody>
    </Card>
  );
}
