import { createRoot } from 'react-dom/client';

function App() {
  return <main><h1>Fall Line</h1></main>;
}

createRoot(document.getElementById('root')!).render(<App />);
