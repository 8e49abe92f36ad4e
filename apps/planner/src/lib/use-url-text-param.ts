import { useEffect, useRef, useState } from 'react';
import { useSearchParams } from 'react-router-dom';

/** Pause in typing before the address is updated (common practice, no source). */
const writeDelayMs = 250;

/**
 * Text kept in the URL's `?key=` (a search box), typed into a local copy so no keystroke is lost
 * while the address catches up. Changes of the address from elsewhere (back button, a link) win.
 */
export function useUrlTextParam(key: string): [string, (value: string) => void] {
  const [params, setParams] = useSearchParams();
  const fromUrl = params.get(key) ?? '';
  const [text, setText] = useState(fromUrl);
  const written = useRef(fromUrl);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  // React Router's functional update sees the params of the render it came from; the timer must
  // use the latest render's, or it would undo changes made while it waited.
  const setParamsRef = useRef(setParams);
  setParamsRef.current = setParams;

  useEffect(() => {
    if (fromUrl !== written.current) {
      written.current = fromUrl;
      setText(fromUrl);
    }
  }, [fromUrl]);

  useEffect(() => () => clearTimeout(timer.current), []);

  const update = (value: string) => {
    setText(value);
    clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      written.current = value;
      setParamsRef.current(
        (prev) => {
          const next = new URLSearchParams(prev);
          if (value) next.set(key, value);
          else next.delete(key);
          return next;
        },
        { replace: true },
      );
    }, writeDelayMs);
  };

  return [text, update];
}
