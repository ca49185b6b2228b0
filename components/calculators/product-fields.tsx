'use client';

import { Select } from '@/components/ui/select';
import { TextField } from '@/components/ui/text-field';
import { JAR_LABELS, JAR_SIZES, PRODUCT_OPTIONS, isProductId } from '@/lib/preserving/products';

export const JAR_OPTIONS = JAR_SIZES.map((j) => ({ value: j, label: JAR_LABELS[j] }));

/** A product id to start from: the one asked for when it exists, else the first product. */
export const startProduct = (id?: string): string => (id && isProductId(id) ? id : PRODUCT_OPTIONS[0].value);

export function ProductSelect({ value, onChange, error }: { value: string; onChange: (value: string) => void; error?: string }) {
  return <Select label="Product" options={PRODUCT_OPTIONS} value={value} onChange={(event) => onChange(event.target.value)} error={error} />;
}

export function JarSelect({ value, onChange, error }: { value: string; onChange: (value: string) => void; error?: string }) {
  return <Select label="Jar size" options={JAR_OPTIONS} value={value} onChange={(event) => onChange(event.target.value)} error={error} />;
}

export function JarsField({ value, onChange, error }: { value: string; onChange: (value: string) => void; error?: string }) {
  return (
    <TextField label="Number of jars" inputMode="numeric" autoComplete="off" value={value} onChange={(event) => onChange(event.target.value)} error={error} />
  );
}
