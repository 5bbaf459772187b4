export { PayBasisScreen } from './components/pay-basis-screen';
export { profilesQuery } from './api/field-records';
