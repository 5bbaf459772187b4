// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { BidItemForm } from '@/features/bid-items/components/bid-item-form';
import { bidItemFormDefaults } from '@/features/bid-items/components/bid-item-form-schema';
import { BidScheduleTable } from '@/features/bid-items/components/bid-schedule-table';
import type { BidItemView } from '@/shared/schemas/bid-item';

afterEach(cleanup);

// Invented items for the table; amounts are quantity x unit price, worked by hand.
function item(overrides: Partial<BidItemView> & Pick<BidItemView, 'id' | 'itemNumber' | 'description'>): BidItemView {
  return {
    projectId: 'p1',
    payUnit: 'CY',
    basis: 'bank',
    unitPriceCents: 1000,
    contractQuantity: 100,
    contractAmountCents: 100_000,
    originalQuantity: overrides.contractQuantity ?? 100,
    originalUnitPriceCents: overrides.unitPriceCents ?? 1000,
    originalAmountCents: overrides.contractAmountCents ?? 100_000,
    changeOrderNumbers: [],
    isMajor: false,
    method: 'end-area',
    createdAt: '2026-01-05T00:00:00.000Z',
    updatedAt: '2026-01-05T00:00:00.000Z',
    ...overrides,
  };
}

const ITEMS: BidItemView[] = [
  item({
    id: 'a',
    itemNumber: '10',
    description: 'Pond excavation',
    unitPriceCents: 850,
    contractQuantity: 2000,
    contractAmountCents: 1_700_000,
  }),
  item({
    id: 'b',
    itemNumber: '2',
    description: 'Trench for culvert',
    payUnit: 'LF',
    unitPriceCents: 2_125,
    contractQuantity: 40,
    contractAmountCents: 85_000,
    method: 'trench',
  }),
  item({
    id: 'c',
    itemNumber: '7',
    description: 'Embankment',
    basis: 'compacted',
    unitPriceCents: 505,
    contractQuantity: 300,
    contractAmountCents: 151_500,
  }),
];

function renderForm() {
  const onSubmit = vi.fn(async () => undefined);
  render(
    <BidItemForm
      defaultValues={bidItemFormDefaults(undefined, 'us')}
      submitLabel="Add bid item"
      onSubmit={onSubmit}
      onCancel={() => {}}
    />,
  );
  return { onSubmit, user: userEvent.setup() };
}

describe('bid item form', () => {
  it('shows the shared schema messages on each bad field and does not submit', async () => {
    const { onSubmit, user } = renderForm();
    await user.type(screen.getByLabelText(/Contract quantity/), '-4');
    await user.type(screen.getByLabelText(/Unit price/), '3.999');
    await user.click(screen.getByRole('button', { name: 'Add bid item' }));

    expect(await screen.findByText('Item number is required')).toBeTruthy();
    expect(screen.getByText('Description is required')).toBeTruthy();
    expect(screen.getByText('Quantity cannot be negative')).toBeTruthy();
    expect(screen.getByText(/at most two decimals/)).toBeTruthy();
    expect(screen.getByLabelText('Item number').getAttribute('aria-invalid')).toBe('true');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('submits the typed dollars as integer cents in the shape the API takes', async () => {
    const { onSubmit, user } = renderForm();
    await user.type(screen.getByLabelText('Item number'), '305-B');
    await user.type(screen.getByLabelText('Description'), 'Basin keyway excavation');
    await user.type(screen.getByLabelText(/Contract quantity/), '1,250.5');
    await user.type(screen.getByLabelText(/Unit price/), '$1,012.07');
    // 1,250.5 CY x $1,012.07 = $1,265,593.535, rounded once to the cent (worked by hand).
    expect(screen.getByText('$1,265,593.54')).toBeTruthy();
    await user.click(screen.getByRole('checkbox'));
    await user.click(screen.getByRole('button', { name: 'Add bid item' }));

    await vi.waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit).toHaveBeenCalledWith({
      itemNumber: '305-B',
      description: 'Basin keyway excavation',
      payUnit: 'CY',
      basis: 'bank',
      unitPriceCents: 101_207,
      contractQuantity: 1250.5,
      isMajor: true,
      method: 'end-area',
    });
  });
});

describe('bid schedule table', () => {
  it('sorts item numbers naturally and shows units beside quantities', () => {
    render(<BidScheduleTable items={ITEMS} contractSumCents={1_936_500} filter="" />);
    const rows = within(screen.getByRole('table')).getAllByRole('row');
    const firstCells = rows.slice(1, 4).map((row) => within(row).getAllByRole('cell')[0]?.textContent);
    expect(firstCells).toEqual(['2', '7', '10']);
    const trenchCells = within(rows[1]!).getAllByRole('cell');
    // Display precision per pay unit (src/shared/format.ts): linear feet to 0.1.
    expect(trenchCells[4]?.textContent).toBe('40.0LF');
    expect(trenchCells[5]?.textContent).toBe('$21.25/LF');
  });

  it('totals the rows a filter leaves and keeps the contract sum from the server', () => {
    render(<BidScheduleTable items={ITEMS} contractSumCents={1_936_500} filter="excavation" />);
    expect(screen.getByText('Shown: 1 of 3 items')).toBeTruthy();
    const shownRow = screen.getByText('Shown: 1 of 3 items').closest('tr');
    expect(shownRow?.textContent).toContain('$17,000.00');
    expect(screen.getByTestId('contract-sum').textContent).toBe('$19,365.00');
  });

  it('offers edit and delete only when commands are given', () => {
    const { unmount } = render(<BidScheduleTable items={ITEMS} contractSumCents={1_936_500} filter="" />);
    expect(screen.queryByRole('button', { name: /Edit/ })).toBeNull();
    unmount();
    render(
      <BidScheduleTable
        items={ITEMS}
        contractSumCents={1_936_500}
        filter=""
        actions={{ onEdit: () => {}, onDelete: () => {} }}
      />,
    );
    expect(screen.getAllByRole('button', { name: /^Edit / })).toHaveLength(3);
  });

  it('says an item paid from tickets is measured by them, its worksheet tallies kept as backup', () => {
    const haul = item({
      id: 'd',
      itemNumber: '12',
      description: 'Haul off unsuitable',
      method: 'load-count',
      paidAs: 'truck_measure',
      talliesNotBilled: 'paid as “Counted loads (truck register)”, not from tallies',
    });
    const ditch = item({
      id: 'e',
      itemNumber: '13',
      description: 'Ditch',
      paidAs: 'worksheet',
      talliesNotBilled: null,
    });
    render(<BidScheduleTable items={[haul, ditch]} contractSumCents={200_000} filter="" />);
    const [, haulRow, ditchRow] = within(screen.getByRole('table')).getAllByRole('row');
    expect(within(haulRow!).getAllByRole('cell')[2]?.textContent).toBe(
      'Counted loads (truck register)Tallies kept as backup only',
    );
    expect(within(ditchRow!).getAllByRole('cell')[2]?.textContent).toBe('Cross sections (end areas)');
  });
});
