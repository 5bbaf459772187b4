/** What the app composes from companies: the company page and its loader's query. */
export { companyPageQueryOptions } from './api/get-company-page';
export { CompanyScreen } from './components/company-screen';
