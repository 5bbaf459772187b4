export { WaiversScreen } from './components/waivers-screen';
export { projectWaiversQueryOptions } from './api/get-waivers';
