import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { VerificationResult } from './verification-result';

const base = {
  found: true as const,
  serial: 'AAAA-BBBB-CCCC-DDDD',
  state: 'valid' as const,
  learnerName: 'Ada Lindqvst',
  courseTitle: 'Safe Pickling and Water-Bath Canning',
  programName: 'Upper Fork preserving program',
  issuedAt: '2026-12-01T12:00:00.000Z',
  validUntil: '2029-12-01T12:00:00.000Z',
  revokedAt: null,
};

describe('VerificationResult', () => {
  it('shows the stored program name with a current certificate', () => {
    render(<VerificationResult result={{ ...base, replaced: null }} timeZone="America/Denver" />);
    expect(screen.getByRole('heading', { name: 'This certificate is valid.' })).toBeInTheDocument();
    expect(screen.getByText('Upper Fork preserving program')).toBeInTheDocument();
  });

  it('shows a replaced serial as replaced, linking to the serial in force, and still says what it said', () => {
    render(
      <VerificationResult result={{ ...base, replaced: { at: '2026-12-03T09:00:00.000Z', bySerial: 'EEEE-FFFF-GGGG-HHHH' } }} timeZone="America/Denver" />,
    );
    expect(screen.getByRole('heading', { name: 'This certificate was replaced by a corrected one.' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'EEEE-FFFF-GGGG-HHHH' })).toHaveAttribute('href', '/verify/EEEE-FFFF-GGGG-HHHH');
    expect(screen.getByText('Ada Lindqvst')).toBeInTheDocument();
    expect(screen.queryByText('This certificate is valid.')).toBeNull();
  });
});
