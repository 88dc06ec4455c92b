import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { AppProvider } from './provider';
import { createAppQueryClient } from './query-client';
import { createAppRouter } from './router';

export const App = () => {
  const [queryClient] = useState(() => createAppQueryClient());
  const [router] = useState(() => createAppRouter());
  return (
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  );
};
