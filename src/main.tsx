import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { z } from 'zod';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import './index.css';

// zod probes for eval (new Function) to compile parsers; under our Content-Security-Policy, which has no
// 'unsafe-eval', the probe is refused and reported as a violation. Its interpreter needs no eval.
z.config({ jitless: true });

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
