export { PaymentsScreen } from './components/payments-screen';
export { projectPaymentsQueryOptions } from './api/get-payments';
