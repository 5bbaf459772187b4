import { Trash2 } from 'lucide-react';
import type * as React from 'react';
import { Button } from '@/components/ui/button';
import { Card, CardBody } from '@/components/ui/card';

/** Inputs on the left, the live result on the right (stacked on narrow screens). */
export function WorksheetColumns({ inputs, result }: { inputs: React.ReactNode; result: React.ReactNode }) {
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <Card aria-label="Inputs" className="self-start">
        <CardBody className="space-y-4 py-4">{inputs}</CardBody>
      </Card>
      <div className="space-y-4">{result}</div>
    </div>
  );
}

/** The inputs form: never submitted (the result is live); the label names it for screen readers. */
export function WorksheetForm({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <form noValidate aria-label={label} className="space-y-4" onSubmit={(e) => e.preventDefault()}>
      {children}
    </form>
  );
}

/** The trash button at the end of an editable row. */
export function RemoveRowButton({ label, onClick }: { label: string; onClick: () => void }) {
  return (
    <Button variant="ghost" size="icon-sm" aria-label={label} onClick={onClick}>
      <Trash2 />
    </Button>
  );
}
