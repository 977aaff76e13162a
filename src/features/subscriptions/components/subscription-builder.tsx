import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { Controller, FormProvider, useForm, useWatch } from 'react-hook-form';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { deliveryGreenGrams } from '@shared/domain/delivery-plan';
import { grindMismatch } from '@shared/domain/grind-fit';
import { formatMoney } from '@shared/domain/money';
import { processLabels, roastLevels, roastersRotationName, type RoastLevel } from '@shared/domain/vocabulary';
import { defaultShopSettings } from '@shared/schemas/settings';
import type { LotDetail, LotSummary } from '@shared/schemas/lots';
import { subscriptionPreviewQuerySchema, type SubscriptionPreviewQuery } from '@shared/schemas/subscription-preview';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { FormAlert } from '@/components/ui/form-alert';
import { paths } from '@/config/paths';
import { useSubscriptionPreview } from '../api/get-subscription-preview';
import { builderDefaults, builderFromSearch, rotationSearchValue, searchFromBuilder, searchNamesLevel, type BuilderFields } from '../utils/builder-search';
import { subscriptionBuilderSchema, type SubscriptionBuild } from '../utils/subscription-form';
import { SubscriptionChoiceFieldset } from './subscription-choice-fields';
import { SubscriptionPricePreview } from './subscription-price-preview';

type SubscriptionBuilderProps = {
  /** Listed lots with green stock to roast from. */
  lots: readonly LotSummary[];
  /** The chosen lot's detail (its allowed and suggested levels), once loaded. */
  chosenLot: LotDetail | undefined;
  signedIn: boolean;
};

/** The part of the choice that sets the price and dates (grind changes neither), or null while incomplete. */
function previewChoiceOf(fields: Partial<BuilderFields>): SubscriptionPreviewQuery | null {
  const { lotCode, roastLevel, bagSize, bagsPerDelivery, brewMethod, cadenceWeeks } = fields;
  const parsed = subscriptionPreviewQuerySchema.safeParse({ lotCode: lotCode ?? undefined, roastLevel, bagSize, bagsPerDelivery, brewMethod, cadenceWeeks });
  return parsed.success ? parsed.data : null;
}

/**
 * The Roasted to Order builder. Every choice is written into the page's URL as it is made, so
 * signing in (or creating an account) on the way to checkout brings the subscriber back to exactly
 * what they built.
 */
export function SubscriptionBuilder({ lots, chosenLot, signedIn }: SubscriptionBuilderProps) {
  const navigate = useNavigate();
  const [search, setSearch] = useSearchParams();
  const [levelNamedInUrl] = useState(() => searchNamesLevel(search));
  const form = useForm<BuilderFields, unknown, SubscriptionBuild>({
    resolver: zodResolver(subscriptionBuilderSchema),
    defaultValues: builderFromSearch(search),
  });
  const { control, setValue, formState } = form;
  const watched = useWatch({ control });
  const searchNow = searchFromBuilder(watched).toString();

  useEffect(() => {
    setSearch(new URLSearchParams(searchNow), { replace: true, preventScrollReset: true });
  }, [searchNow, setSearch]);

  // A lot limits the levels; until the subscriber picks one, its suggested level is taken.
  const levelPicked = levelNamedInUrl || formState.dirtyFields.roastLevel === true;
  const allowedLevels: readonly RoastLevel[] = watched.lotCode ? (chosenLot?.allowedLevels ?? roastLevels) : roastLevels;
  useEffect(() => {
    if (!chosenLot || chosenLot.code !== watched.lotCode) return;
    const level = watched.roastLevel;
    if (!level || !chosenLot.allowedLevels.includes(level) || !levelPicked) setValue('roastLevel', chosenLot.suggestedLevel);
    // Only a newly loaded lot decides this; the subscriber's own picks afterwards stand.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [chosenLot]);

  // The last complete choice keeps the price on screen while a bag count is half typed.
  const [previewChoice, setPreviewChoice] = useState(
    () => previewChoiceOf(builderFromSearch(search)) ?? (previewChoiceOf(builderDefaults) as SubscriptionPreviewQuery),
  );
  const choiceNow = previewChoiceOf(watched);
  if (choiceNow && JSON.stringify(choiceNow) !== JSON.stringify(previewChoice)) setPreviewChoice(choiceNow);
  const preview = useSubscriptionPreview(previewChoice);

  // A lot without the green for this delivery cannot be roasted: offer the Roaster's Rotation instead (checkout refuses it too).
  const soldOut =
    chosenLot !== undefined &&
    chosenLot.code === watched.lotCode &&
    chosenLot.stockGrams <
      deliveryGreenGrams(
        { roastLevel: watched.roastLevel ?? chosenLot.suggestedLevel, bagSize: watched.bagSize ?? '12oz', bagsPerDelivery: watched.bagsPerDelivery ?? 1 },
        defaultShopSettings,
      );

  // A grind that contradicts the brew method is asked about once; changing either asks again.
  const mismatch = watched.brewMethod && watched.grind ? grindMismatch(watched.brewMethod, watched.grind) : null;
  const [confirmedMismatch, setConfirmedMismatch] = useState<string | null>(null);
  const [askGrind, setAskGrind] = useState(false);
  if (askGrind && mismatch !== null && confirmedMismatch === mismatch) setAskGrind(false);

  const shippingHref = paths.subscribeShipping.getHref(new URLSearchParams(searchNow));
  const goOn = () => navigate(signedIn ? shippingHref : paths.signIn.getHref(shippingHref));
  const submit = form.handleSubmit(() => {
    if (soldOut) return;
    if (mismatch && confirmedMismatch !== mismatch) {
      setAskGrind(true);
      return;
    }
    goOn();
  });
  const bagPrices = preview.data
    ? Object.fromEntries(Object.entries(preview.data.bagPriceCents).map(([size, cents]) => [size, formatMoney(cents, preview.data.currency)]))
    : undefined;

  const coffeeChoices = [
    { value: rotationSearchValue, label: roastersRotationName, detail: 'A different lot each time, picked by our roaster for the roast day.' },
    ...lots.map((lot) => ({
      value: lot.code,
      label: lot.name,
      detail: [lot.origin, processLabels[lot.process], lot.tastingNotes.slice(0, 3).join(', ')].filter(Boolean).join(' · '),
    })),
  ];

  return (
    <FormProvider {...form}>
      <form noValidate aria-label="Build your subscription" onSubmit={(event) => void submit(event)} className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="grid content-start gap-8">
          <Controller
            control={control}
            name="lotCode"
            render={({ field }) => (
              <ChoiceGroup
                legend="Coffee"
                hint="One lot, roasted for you each time, or the Roaster’s Rotation."
                name="builder-coffee"
                columns={2}
                choices={coffeeChoices}
                value={field.value ?? rotationSearchValue}
                onChange={(value) => field.onChange(value === rotationSearchValue ? null : value)}
                error={formState.errors.lotCode?.message}
              />
            )}
          />
          {soldOut ? (
            <FormAlert>
              <span>
                {chosenLot.name} is sold out: there is not enough green coffee left to roast this delivery.{' '}
                <button type="button" className="font-semibold text-leaf underline" onClick={() => setValue('lotCode', null, { shouldDirty: true })}>
                  Choose the Roaster’s Rotation instead
                </button>
              </span>
            </FormAlert>
          ) : null}
          <SubscriptionChoiceFieldset allowedLevels={allowedLevels} idPrefix="builder" bagPrices={bagPrices} />
          {askGrind && mismatch ? (
            <FormAlert>
              <span>
                {mismatch} Keep it, or choose another grind above.{' '}
                <button
                  type="button"
                  className="font-semibold text-leaf underline"
                  onClick={() => {
                    setConfirmedMismatch(mismatch);
                    setAskGrind(false);
                    goOn();
                  }}
                >
                  Keep this grind and continue
                </button>
              </span>
            </FormAlert>
          ) : null}
        </div>
        {/* On a phone the aside's boxes join the form's column, so the price and Continue can stay in view at the bottom. */}
        <aside aria-label="Price and first deliveries" className="contents lg:sticky lg:top-6 lg:block lg:self-start">
          <div className="rounded-card border border-rule bg-paper-shade/40 p-5">
            <SubscriptionPricePreview
              preview={preview.data}
              updating={preview.isPlaceholderData || preview.isFetching}
              error={preview.error}
              onRetry={() => void preview.refetch()}
              cadenceWeeks={watched.cadenceWeeks ?? 2}
            />
          </div>
          <div
            data-testid="builder-action-bar"
            className="sticky bottom-0 z-10 -mx-4 grid gap-2 border-t border-rule bg-sheet px-4 py-3 shadow-card lg:static lg:mx-0 lg:mt-4 lg:border-0 lg:bg-transparent lg:p-0 lg:shadow-none"
          >
            {preview.data ? (
              <p className="text-small font-semibold lg:hidden">{`${formatMoney(preview.data.priceCents, preview.data.currency)} each delivery`}</p>
            ) : null}
            <Button type="submit" disabled={soldOut}>
              {signedIn ? 'Continue to the shipping address' : 'Sign in to continue'}
            </Button>
            {signedIn ? null : (
              <p className="text-small text-ink-muted">
                New here?{' '}
                <Link to={paths.createAccount.getHref(shippingHref)} className="font-semibold text-leaf underline">
                  Create an account
                </Link>
                . Your choices are kept.
              </p>
            )}
          </div>
        </aside>
      </form>
    </FormProvider>
  );
}
