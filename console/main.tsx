import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router/dom';
import { AppProvider } from './app/provider';
import { queryClient } from './app/query-client';
import { createAppRouter } from './app/router';
import './styles/index.css';

const router = createAppRouter(queryClient);
const container = document.getElementById('root');
if (!container) throw new Error('The console page has no #root element.');

createRoot(container).render(
  <StrictMode>
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  </StrictMode>,
);
