import '@fontsource/lora/latin-600.css';
import '@fontsource/source-sans-3/latin-400.css';
import '@fontsource/source-sans-3/latin-600.css';
import '@fontsource/source-sans-3/latin-700.css';
import './index.css';

import { hydrate, type DehydratedState } from '@tanstack/react-query';
import { render, type ComponentChild } from 'preact';
import { StrictMode } from 'react';
import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from './app/provider';
import { createAppRoutes } from './app/router';
import { createQueryClient } from './lib/query-client';

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element.');

const queryClient = createQueryClient();
// A page the server rendered brings the query cache it was rendered from (src/entry-server.tsx).
const queryState = document.getElementById('restday-query-state')?.textContent;
if (queryState) hydrate(queryClient, JSON.parse(queryState) as DehydratedState);
const router = createBrowserRouter(createAppRoutes(queryClient));

/** Resolves once the router has the first page's code and loader results. */
function routerReady(): Promise<void> {
  return new Promise((resolve) => {
    if (router.state.initialized) return resolve();
    const unsubscribe = router.subscribe((state) => {
      if (!state.initialized) return;
      unsubscribe();
      resolve();
    });
  });
}

// The server's markup stays on screen until the page's code has arrived; then Preact's own render
// (not the compatibility layer's, which empties the container first, as React does) draws the
// same page over it, keeping its elements and correcting any attribute that differs.
void (queryState ? routerReady() : Promise.resolve()).then(() => {
  const app = (
    <StrictMode>
      <AppProvider queryClient={queryClient}>
        <RouterProvider router={router} />
      </AppProvider>
    </StrictMode>
  );
  render(app as ComponentChild, container);
  // From here the page answers clicks and typing (browser tests wait for it after a page load).
  container.dataset.appReady = 'true';
});
