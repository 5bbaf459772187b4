/** What other screens embed from the trail: the pay application's trail panel. */
export { TrailPanel } from './components/trail-panel';
