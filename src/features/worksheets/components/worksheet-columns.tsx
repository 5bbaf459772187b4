import type * as React from 'react';
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
