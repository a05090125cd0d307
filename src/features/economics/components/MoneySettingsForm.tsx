import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { type MoneySettingsInput, moneySettingsSchema, type SettingsView } from "@shared/economics/schemas";
import { fromMinorUnits } from "@shared/money/minor-units";
import { commonCurrencies } from "@shared/slate/schemas";
import { FormActions, NumberField, SelectField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { applyServerErrors } from "../../../lib/forms";
import { useSaveMoneySettings } from "../api/save-settings";

/** The currency every total is in, and what an hour of a member's work costs the channel. */
export function MoneySettingsForm({ channelId, settings }: { channelId: string; settings: SettingsView }) {
  const save = useSaveMoneySettings(channelId);
  const values = { currency: settings.currency, hourRate: settings.hourRateMinor === null ? "" : fromMinorUnits(settings.hourRateMinor, settings.currency), version: settings.version };
  const form = useForm<MoneySettingsInput>({ resolver: zodResolver(moneySettingsSchema) as never, values });
  const { errors } = form.formState;
  const currencies = [...new Set([settings.currency, ...commonCurrencies])].map((c) => ({ value: c, label: c }));
  const submit = form.handleSubmit(async (body) => {
    try {
      await save.mutateAsync({ ...body, hourRate: body.hourRate ?? "" });
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ["currency", "hourRate"]);
      if (message) form.setError("root", { type: "server", message });
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4" aria-label="Money settings">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <SelectField
          label="Totals in"
          options={currencies}
          disabled={!settings.currencyChangeable}
          hint={settings.currencyChangeable ? "Fixed once money is recorded." : "Fixed: money is recorded in it."}
          {...form.register("currency")}
          error={errors.currency?.message}
        />
        <NumberField label={`Hourly rate (${settings.currency})`} hint="Members' hours cost this; blank leaves hours uncounted." {...form.register("hourRate")} error={errors.hourRate?.message} />
      </div>
      {errors.root?.message && <Notice kind="error">{errors.root.message}</Notice>}
      {save.isSuccess && <Notice kind="success">Saved.</Notice>}
      <FormActions submit="Save" busy={save.isPending} />
    </form>
  );
}
