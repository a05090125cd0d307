ALTER TABLE "deals" ALTER COLUMN "fee_amount" SET DATA TYPE numeric(16, 4);--> statement-breakpoint
-- ISO 4217's minor unit of a currency, as shared/money/minor-units.ts holds it (tests/api/search.test.ts checks they agree).
CREATE FUNCTION "currency_minor_digits"(code text) RETURNS integer LANGUAGE sql IMMUTABLE AS $$
  SELECT CASE
    WHEN code IN ('BIF', 'CLP', 'DJF', 'GNF', 'ISK', 'JPY', 'KMF', 'KRW', 'PYG', 'RWF', 'UGX', 'UYI', 'VND', 'VUV', 'XAF', 'XOF', 'XPF') THEN 0
    WHEN code IN ('BHD', 'IQD', 'JOD', 'KWD', 'LYD', 'OMR', 'TND') THEN 3
    WHEN code IN ('CLF', 'UYW') THEN 4
    ELSE 2
  END
$$;--> statement-breakpoint
-- The fee is searched as its currency writes it ("98765.43 EUR", "1800.125 KWD"), not with the column's four decimals.
CREATE OR REPLACE FUNCTION "search_deal_doc"(r deals) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('deal', r.id, r.channel_id, r.episode_id, 'sponsors', s.company,
    search_lines(array_to_string(ARRAY(SELECT jsonb_array_elements_text(r.talking_points)), E'\n'),
      r.promo_code, r.disclosure_text, r.exclusivity_notes, r.description_copy, r.script),
    jsonb_build_object('sponsorId', r.sponsor_id))
  FROM sponsors s WHERE s.id = r.sponsor_id;
  SELECT search_put('dealMoney', r.id, r.channel_id, r.episode_id, 'fees', s.company,
    search_lines(r.invoice_number, round(r.fee_amount, currency_minor_digits(r.currency))::text || ' ' || r.currency),
    jsonb_build_object('sponsorId', r.sponsor_id))
  FROM sponsors s WHERE s.id = r.sponsor_id
$$;--> statement-breakpoint
SELECT search_deal_doc(d) FROM deals d;
