import '@tanstack/react-table';

declare module '@tanstack/react-table' {
  // Augments the library's interface; the type parameters must match its declaration.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Right-aligned in tabular figures. */
    numeric?: boolean;
  }
}
