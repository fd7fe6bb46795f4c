import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { StartScreen } from './StartScreen';

const root = document.getElementById('root');
if (root) createRoot(root).render(<StrictMode><StartScreen /></StrictMode>);
