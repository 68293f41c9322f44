import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import './index.css';
import { Providers } from './app/providers';
import { queryClient } from './app/query-client';
import { createRouter } from './app/router';
import { installSessionExpiryHandler } from './app/session-expiry';

const router = createRouter();
installSessionExpiryHandler(router, queryClient);

const container = document.getElementById('root');
if (!container) throw new Error('index.html needs a <div id="root">');

createRoot(container).render(
  <StrictMode>
    <Providers>
      <RouterProvider router={router} />
    </Providers>
  </StrictMode>,
);
