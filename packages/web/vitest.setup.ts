import '@testing-library/jest-dom/vitest';
import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

// Fluent UI's tabster keeps DOM references between tests; without cleanup it throws "NodeFilter is not defined".
afterEach(cleanup);
