import { useParams } from 'react-router-dom';
import { PrintShiftSheetsPage } from '@/features/shift-sheets/print';
import NotFoundRoute from './app/not-found';
import { parseIdParam } from './app/parse-id-param';

/** /print/shift-sheets/:planId — the sheets for paper, outside the app shell. */
export default function PrintShiftSheetsRoute() {
  const id = parseIdParam(useParams().planId);
  if (id === null) return <NotFoundRoute />;
  return <PrintShiftSheetsPage key={id} planId={id} />;
}
