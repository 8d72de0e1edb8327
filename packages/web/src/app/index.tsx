import { RouterProvider } from 'react-router-dom';
import { AppProvider } from './provider';
import { createAppRouter } from './router';
import { createQueryClient } from '@/lib/query-client';

const queryClient = createQueryClient();
const router = createAppRouter();

export function App() {
  return (
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
