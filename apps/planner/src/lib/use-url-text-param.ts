import { useEffect, useRef, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { withSearchParam } from './search-params';

/**
 * Text kept in the URL's `?key=` (a search box). The input shows a local copy, so no keystroke is
 * lost while the address catches up (React Router applies it in a transition); each change is
 * written at once, so it is in the address before the next click. Changes of the address from
 * elsewhere (back button, a link) win.
 */
export function useUrlTextParam(key: string): [string, (value: string) => void] {
  const [params, setParams] = useSearchParams();
  const fromUrl = params.get(key) ?? '';
  const [text, setText] = useState(fromUrl);
  // Values this box wrote that the address may still pass through on its way to the last one.
  const written = useRef(new Set<string>([fromUrl]));

  useEffect(() => {
    if (written.current.has(fromUrl)) return; // our own write arriving (possibly an older one)
    written.current = new Set([fromUrl]);
    setText(fromUrl);
  }, [fromUrl]);

  const update = (value: string) => {
    setText(value);
    written.current.add(value);
    setParams((prev) => withSearchParam(prev, key, value), { replace: true });
  };

  return [text, update];
}
