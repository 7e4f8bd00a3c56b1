// Worker-thread entry for `--jobs`: registers the TypeScript loader in this thread, then runs the
// named export of the task module the pool asks for.
import { register } from 'tsx/esm/api';

register();
const modules = new Map();

export default async function runTask({ module, name, payload }) {
  let loaded = modules.get(module);
  if (loaded === undefined) {
    loaded = await import(module);
    modules.set(module, loaded);
  }
  return loaded[name](payload);
}
