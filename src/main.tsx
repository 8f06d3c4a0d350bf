import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/App';
import { firstDrawing } from './app/router';
import './styles.css';

const root = createRoot(document.getElementById('root')!);
void firstDrawing.then(() =>
  root.render(
    <StrictMode>
      <App />
    </StrictMode>,
  ),
);
