import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Certificate } from '@millrace/contracts';
import { verifiedCertificate } from '@/testing/plan-fixtures';
import { CertificatePanel } from './certificate-panel';

const withCheck = (crossCheck: Partial<NonNullable<Certificate['crossCheck']>> | null): Certificate => ({
  ...verifiedCertificate,
  crossCheck: crossCheck === null ? null : { ...verifiedCertificate.crossCheck!, ...crossCheck },
});

describe('certificate panel', () => {
  it('when the second solver agrees, then it says verified and shows gap, residuals and the cross-check', () => {
    render(<CertificatePanel certificate={verifiedCertificate} currency="EUR" />);
    const panel = screen.getByRole('region', { name: 'Certificate' });
    expect(panel).toHaveTextContent('Verified by a second solver');
    expect(panel).toHaveTextContent('Duality gap (relative)2.0e-11');
    expect(panel).toHaveTextContent('Primal residual2.7e-16');
    expect(panel).toHaveTextContent('Dual residual1.2e-18');
    expect(panel).toHaveTextContent('Second solverHiGHS');
    expect(panel).toHaveTextContent('Time2.2 s');
    // Money is shown to the cent like every other margin on the page (common practice, no source).
    expect(panel).toHaveTextContent("Its margin1,000.00 EUR");
    expect(panel).toHaveTextContent("Plan's margin1,000.00 EUR");
  });

  it('when the second solver disagrees, then it says unverified plainly and never verified', () => {
    render(<CertificatePanel certificate={withCheck({ status: 'unverified', objective: 950, relativeDifference: 0.05, message: 'HiGHS found 950.' })} currency="EUR" />);
    const panel = screen.getByRole('region', { name: 'Certificate' });
    expect(panel).toHaveTextContent('Unverified: the second solver disagrees');
    expect(panel).toHaveTextContent('HiGHS found 950.');
    expect(panel).not.toHaveTextContent('Verified by');
  });

  it('when the check did not finish, then it says "not finished" and that no margin was reached', () => {
    render(<CertificatePanel certificate={withCheck({ status: 'not_finished', objective: null, relativeDifference: null, seconds: 60, message: 'Time limit.' })} currency="EUR" />);
    const panel = screen.getByRole('region', { name: 'Certificate' });
    expect(panel).toHaveTextContent('Cross-check not finished');
    expect(panel).toHaveTextContent('Its marginnot reached');
    expect(panel).not.toHaveTextContent('Verified by');
  });

  it('when there is no cross-check or no certificate yet, then it says so instead of showing empty numbers', () => {
    const { unmount } = render(<CertificatePanel certificate={withCheck(null)} currency="EUR" />);
    expect(screen.getByRole('region', { name: 'Certificate' })).toHaveTextContent('Cross-check not started');
    unmount();
    render(<CertificatePanel certificate={null} currency="EUR" />);
    expect(screen.getByRole('region', { name: 'Certificate' })).toHaveTextContent('No certificate yet');
  });
});
