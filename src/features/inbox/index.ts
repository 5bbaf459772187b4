/** What the app composes from the inbox: the screen, the header link, and the loader's query. */
export { inboxQueryOptions } from './api/get-inbox';
export { InboxLink } from './components/inbox-link';
export { InboxScreen } from './components/inbox-screen';
