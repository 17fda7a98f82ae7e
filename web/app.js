// Controller: creates the core client and the views, wires the form, and
// runs the built-in example on load.
import { CoreClient } from './core-client.js';
import { clear, showErrors, showHeatingValue, showStatus } from './view.js';
import { registerServiceWorker } from './offline.js';

const EXAMPLE_REQUEST = { formula: 'C3H8' };  // propane

const core = new CoreClient();

async function computeInto(container, errorTarget, request) {
  showStatus(container, 'Computing…');
  showErrors(errorTarget, []);
  try {
    const result = await core.heatingValue(request);
    if (Array.isArray(result.errors) && result.errors.length) {
      clear(container);
      showErrors(errorTarget, result.errors);
      return;
    }
    showHeatingValue(container, result);
  } catch (error) {
    clear(container);
    showErrors(errorTarget, error);
  }
}

function start() {
  const exampleResult = document.getElementById('example-result');
  const form = document.getElementById('hv-form');
  const input = document.getElementById('formula-input');
  const submit = document.getElementById('hv-submit');
  const result = document.getElementById('hv-result');
  const error = document.getElementById('hv-error');

  // The example has no error line of its own: failures show in its container.
  const exampleError = document.createElement('p');
  exampleError.className = 'error';
  exampleError.hidden = true;
  exampleResult.after(exampleError);
  computeInto(exampleResult, exampleError, EXAMPLE_REQUEST);

  form.addEventListener('submit', async (event) => {
    event.preventDefault();
    const formula = input.value.trim();
    submit.disabled = true;
    try {
      await computeInto(result, error, { formula });
    } finally {
      submit.disabled = false;
    }
  });

  registerServiceWorker();
}

start();
