import type * as React from 'react';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { ErrorState, LoadingState } from '@/components/ui/states';

type Query<T> = { isPending: boolean; isError: boolean; error: unknown; data?: T; refetch: () => unknown };

/** A card for one register: its title, a note on the rule behind it, and its body once loaded. */
export function RegisterCard<T>({
  title,
  note,
  query,
  actions,
  children,
}: {
  title: string;
  note?: React.ReactNode;
  query: Query<T>;
  actions?: React.ReactNode;
  children: (data: T) => React.ReactNode;
}) {
  return (
    <Card>
      <CardHeader>
        <CardTitle>{title}</CardTitle>
        {actions}
      </CardHeader>
      <CardBody className="flex flex-col gap-3">
        {note ? <p className="text-xs text-stone-600">{note}</p> : null}
        {query.isPending ? (
          <LoadingState label={`Loading ${title.toLowerCase()}…`} />
        ) : query.isError || query.data === undefined ? (
          <ErrorState error={query.error} onRetry={() => void query.refetch()} />
        ) : (
          children(query.data)
        )}
      </CardBody>
    </Card>
  );
}

export function Empty({ children }: { children: React.ReactNode }) {
  return <p className="text-sm text-stone-500">{children}</p>;
}
