import type { Tone } from '@/components/ui/badge';

export const STATUS_LABEL = { awaiting_payment: 'Fee not paid yet', active: 'Taking the course', completed: 'Finished', withdrawn: 'Withdrew' } as const;
export const STATUS_TONE: Record<keyof typeof STATUS_LABEL, Tone> = { awaiting_payment: 'honey', active: 'brine', completed: 'copper', withdrawn: 'beet' };
export const CERT_LABEL = { valid: 'Valid', expired: 'Expired', revoked: 'Revoked' } as const;
export const CERT_TONE: Record<keyof typeof CERT_LABEL, Tone> = { valid: 'brine', expired: 'honey', revoked: 'beet' };

export const formatDate = (iso: string | Date) => new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(iso));
