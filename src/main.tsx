import { createRoot } from 'react-dom/client';
import { setNonce } from 'get-nonce';
import '@fontsource/nunito-sans/400.css';
import '@fontsource/nunito-sans/600.css';
import '@fontsource/nunito-sans/700.css';
import '@fontsource/nunito-sans/800.css';
import './styles/index.css';
import { AppProvider } from './app/provider';
import { CACHE_MAX_AGE_MS, createQueryClient, keptOnDevice, lastAnswers } from './app/query-client';
import { createAppRouter, sendToSignIn } from './app/router';
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { persistQueryClient } from '@tanstack/react-query-persist-client';
import { queryCacheStorage } from './lib/device-store';
import { createAppOutbox, waitingIn } from './app/outbox';
import { registerServiceWorker } from './app/service-worker';

// The server's Content-Security-Policy allows a <style> element only with this response's nonce.
const nonce = document.querySelector<HTMLMetaElement>('meta[name="csp-nonce"]')?.content;
if (nonce && nonce !== '__CSP_NONCE__') setNonce(nonce);

// The app's one QueryClient and one router; when the session ends, each needs the other.
const queryClient = createQueryClient({ onUnauthenticated: () => sendToSignIn(router, queryClient) });
const outbox = createAppOutbox(queryClient);
registerServiceWorker();

// The last data the server sent is restored from the device while the router starts: the first page's
// code and the reads that need nothing kept go out at once, and its loaders wait for what is kept
// before they ask "who is signed in?" (with no signal only the kept answer can reply).
const persister = createAsyncStoragePersister({
  storage: queryCacheStorage,
  key: 'scrubline-cache',
  throttleTime: 1000,
  serialize: (client) => JSON.stringify(lastAnswers(client)),
});
const [, restored] = persistQueryClient({
  queryClient,
  persister,
  maxAge: CACHE_MAX_AGE_MS,
  buster: __APP_VERSION__,
  dehydrateOptions: { shouldDehydrateQuery: keptOnDevice },
});
// A device that cannot read its storage (a private window in some browsers) still opens the app.
const deviceRead = Promise.all([restored, outbox.ready()]).catch(() => undefined);
const router = createAppRouter(queryClient, { waiting: waitingIn(outbox), read: deviceRead });

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element');

createRoot(container).render(<AppProvider queryClient={queryClient} router={router} outbox={outbox} />);
await deviceRead;
// Mutations that were paused when the page closed carry on.
void queryClient.resumePausedMutations();
