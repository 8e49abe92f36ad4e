import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { PlanSummary } from '@millrace/contracts';
import { PageHeader } from '@/components/ui/page-header';
import { PlanStateBadge } from './plan-state-badge';

export interface SubPageLink {
  to: string;
  label: string;
}

/** The header of a page about one plan version (results, review): title, state and links. */
export function PlanSubPageHeader({ title, plan, links, actions }: { title: string; plan: Pick<PlanSummary, 'id' | 'name' | 'state'>; links: SubPageLink[]; actions?: ReactNode }) {
  return (
    <PageHeader
      title={`${title} #${plan.id} ${plan.name}`}
      description={
        <span className="flex items-center gap-3">
          <PlanStateBadge state={plan.state} />
          {links.map((link) => (
            <Link key={link.to} className="text-race-700 underline" to={link.to}>
              {link.label}
            </Link>
          ))}
        </span>
      }
      actions={actions}
    />
  );
}
