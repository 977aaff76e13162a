import '@fontsource/lora/latin-600.css';
import '@fontsource/source-sans-3/latin-400.css';
import '@fontsource/source-sans-3/latin-600.css';
import '@fontsource/source-sans-3/latin-700.css';
import './index.css';

import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element.');

createRoot(container).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
