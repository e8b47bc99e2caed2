import '@fontsource/open-sans/latin-400.css';
import '@fontsource/open-sans/latin-600.css';
import '@fontsource/open-sans/latin-700.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import { registerSW } from 'virtual:pwa-register';
import { AppProvider } from '@/app/provider';
import { createAppRouter } from '@/app/router';
import { createQueryClient } from '@/lib/query-client';
import { deviceStore } from '@/lib/sync/device-store';

const container = document.getElementById('root');
if (container === null) throw new Error('index.html has no #root element');

const queryClient = createQueryClient();

// The service worker keeps the app shell, fonts and the last answers of the API on this device, so the app
// opens underground with no network (issue 17). Registered here, not by an inline script (strict CSP).
if ('serviceWorker' in navigator) {
  registerSW({ immediate: true });
  // On the first visit the answers read before the worker took the page over (who is signed in, the
  // Board) went past it and were not kept: they are asked again through it, so a reload underground
  // without any reload in the open before still opens the app.
  navigator.serviceWorker.addEventListener('controllerchange', () => void queryClient.invalidateQueries());
}

// Drafts and the outbox (IndexedDB) are read before the router runs its first loaders and the screens,
// which read them synchronously.
void deviceStore.open().then(() => {
  const router = createAppRouter(queryClient);
  createRoot(container).render(
    <StrictMode>
      <AppProvider queryClient={queryClient}>
        <RouterProvider router={router} />
      </AppProvider>
    </StrictMode>,
  );
});
