/** The e-mail form on a pack page: buy a paid pack (off to the payment page) or take a free one (link by e-mail). */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Linking, Platform } from 'react-native';
import { checkoutBody } from '../../db/validation-packs';
import { applyServerErrors } from '../../hooks/form-errors';
import { useCheckout, type PackPublic } from '../../hooks/use-packs';
import { Button } from '../ui/button';
import { EMAIL_ENTRY, FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';

/** Renders the form for `pack`; after a free take it says where the link went. */
export function BuyPackForm({ pack }: { pack: PackPublic }) {
  const checkout = useCheckout(pack.slug);
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({ resolver: zodResolver(checkoutBody), defaultValues: { email: '' } });
  const free = pack.priceCents === 0;
  const submit = handleSubmit((body) => {
    setFormError(null);
    checkout.mutate(body, {
      onSuccess: (res) => {
        if (res.url) {
          if (Platform.OS === 'web') window.location.assign(res.url);
          else void Linking.openURL(res.url);
        } else if (res.emailed) setSentTo(body.email);
        else setFormError('The pack is yours, but the e-mail with the link could not be sent. Try again in a few minutes.');
      },
      onError: (e) => setFormError(applyServerErrors(e, ['email'], setError)),
    });
  });
  if (sentTo) {
    return (
      <Notice tone="note" title="Check your e-mail">
        The download link is on its way to {sentTo}. It works for 24 hours and for 5 file downloads.
      </Notice>
    );
  }
  return (
    <>
      <FormTextField
        control={control}
        name="email"
        label="Your e-mail (the download link is sent here)"
        {...EMAIL_ENTRY}
        onSubmitEditing={submit}
      />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <Button
        label={free ? 'Take it free' : `Buy for ${pack.priceLabel}`}
        accessibilityLabel={free ? 'Take it free' : 'Buy this pack'}
        onPress={submit}
        busy={checkout.isPending}
      />
    </>
  );
}
