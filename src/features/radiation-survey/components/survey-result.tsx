import { formatCalendarDate } from '@shared/format/dates';
import { HEATING_MEDIUM_LABELS, RADIATOR_TYPE_LABELS, type RadiationSurveyDto, type RadiatorDto } from '@shared/schemas/radiation-surveys';
import { formatBtuh, formatEdr } from './format';
import { SizingCautions } from './sizing-cautions';

export function radiatorWords(r: RadiatorDto): string {
  const n = r.count > 1 ? `${r.count} × ` : '';
  switch (r.type) {
    case 'cast_iron_column':
      return `${n}${r.columns}-column, ${r.heightIn} in, ${r.sections} sections`;
    case 'tube':
      return `${n}${r.tubes}-tube, ${r.heightIn} in, ${r.sections} sections`;
    case 'wall':
      return `${n}wall ${r.size}, ${r.sections} sections`;
    case 'convector':
      return `${n}convector rated ${formatEdr(r.ratedEdrSqFt)}`;
    case 'baseboard':
      return `${n}baseboard, ${r.lengthFt} ft at ${r.ratedEdrSqFtPerFt} sq ft per ft`;
  }
}

function Figure({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex flex-col">
      <dt className="text-xs font-semibold uppercase tracking-wide text-iron-muted">{label}</dt>
      <dd className="tabular text-lg font-bold" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

/** What the survey asks of a replacement, beside the old boiler's nameplate. */
export function SurveyResult({ survey }: { survey: RadiationSurveyDto }) {
  const s = survey.sizing;
  const steam = survey.system === 'steam';
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-iron-muted">
        {HEATING_MEDIUM_LABELS[survey.system]}
        {survey.designWaterF !== null && ` at ${survey.designWaterF} °F average water`} · surveyed {formatCalendarDate(survey.surveyedOn)}
        {survey.surveyedBy && ` by ${survey.surveyedBy}`}
      </p>
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        <Figure label="Connected radiation" value={`${formatEdr(s.totalEdrSqFt)} EDR`} testId="total-edr" />
        <Figure label={`Net load (${s.btuhPerSqFtEdr} Btu/h per sq ft)`} value={formatBtuh(s.netLoadBtuh)} testId="net-load" />
        <Figure label={`Gross output (× ${s.pipingPickupFactor})`} value={formatBtuh(s.grossOutputBtuh)} testId="gross-output" />
        <Figure label="Suitable net ratings" value={`${formatBtuh(s.suitableNetRatingBtuh.min)} to ${formatBtuh(s.suitableNetRatingBtuh.max)}`} testId="suitable-range" />
        <Figure label="Old boiler's input (nameplate)" value={formatBtuh(survey.nameplate.inputBtuh)} testId="nameplate-input" />
        <Figure label="Old boiler's output (nameplate)" value={formatBtuh(survey.nameplate.grossOutputBtuh)} testId="nameplate-output" />
      </dl>
      <p>
        {steam
          ? 'A steam boiler is sized to the connected radiation, not to the house’s heat loss: it must fill every radiator with steam. Choose one whose net rating covers the load.'
          : 'A hot-water boiler is chosen by its net rating against the radiation at the design water temperature; a heat-loss calculation of the house is the better basis where one is made.'}{' '}
        The gross output adds the piping and pickup allowance that published net ratings assume (I=B=R rating basis). A boiler more than a quarter above the
        load is oversized (common practice).
      </p>
      <table className="tabular w-full text-left text-sm">
        <thead>
          <tr>
            <th className="py-1">Room and radiators</th>
            <th className="py-1 text-right">EDR</th>
          </tr>
        </thead>
        <tbody>
          {survey.rooms.map((room) => (
            <tr key={room.id} className="border-t border-plate-line align-top">
              <td className="py-1">
                <span className="font-semibold">{room.name}</span>
                <ul>
                  {room.radiators.map((r) => (
                    <li key={r.id}>
                      {RADIATOR_TYPE_LABELS[r.type]}: {radiatorWords(r)} ({formatEdr(r.edrSqFt)})
                    </li>
                  ))}
                </ul>
              </td>
              <td className="py-1 text-right font-semibold">{formatEdr(room.edrSqFt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {survey.notes && <p className="whitespace-pre-wrap text-sm">Notes: {survey.notes}</p>}
      <SizingCautions />
    </div>
  );
}
