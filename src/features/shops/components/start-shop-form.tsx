import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type * as z from '@shared/zod';
import { createShopInputSchema, type CreateShopInput, type ShopSummary } from '@shared/collab/shop.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateShop } from '../api/create-shop';

/** Opens a new shop with the user as its first admin. */
export function StartShopForm({ onCreated }: { onCreated?: (shop: ShopSummary) => void }) {
  const create = useCreateShop();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof createShopInputSchema>, unknown, CreateShopInput>({
    resolver: zodResolver(createShopInputSchema),
    defaultValues: { name: '' },
  });
  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    create.mutate(input, {
      onSuccess: (shop) => onCreated?.(shop),
      onError: (error) =>
        setFormError(
          isApiError(error) && error.code === 'network'
            ? 'This needs a connection. Try again when you have signal.'
            : applyServerErrors(error, setError, ['name']),
        ),
    });
  });
  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Open a shop" className="flex flex-col gap-3">
      <TextField label="Shop name" autoComplete="organization" error={formState.errors.name?.message} {...register('name')} />
      <FormAlert message={formError} />
      <div>
        <Button type="submit" isPending={create.isPending} pendingLabel="Opening…">
          Open the shop
        </Button>
      </div>
    </form>
  );
}
