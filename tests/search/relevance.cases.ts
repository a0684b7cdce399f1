// Search relevance cases for the seed knowledge base (kb/*.md). Each query must return the
// expected slug among the first three results. Queries are what a service tech or the desk would
// type: typos, the trade's abbreviations, model numbers with and without dashes, plurals and
// plain-language symptoms. Cases whose note starts with 'staff:' expect a staff-only article and
// are run as a desk user.

export const RELEVANCE_CASES: { query: string; expect: string; note: string }[] = [
  // Gas supply and manifold pressure
  {
    query: 'inlet gas pressure under fire',
    expect: 'inlet-gas-pressure-static-and-under-fire',
    note: 'plain wording',
  },
  {
    query: 'water column inlet',
    expect: 'inlet-gas-pressure-static-and-under-fire',
    note: 'synonym w.c.=water column',
  },
  { query: 'suply presure static', expect: 'inlet-gas-pressure-static-and-under-fire', note: 'typo' },
  { query: 'manfold presure single stage', expect: 'manifold-pressure-single-stage-cv-s80', note: 'typo' },
  { query: 'CV-S80 manifold', expect: 'manifold-pressure-single-stage-cv-s80', note: 'model with dash' },
  {
    query: 'CVS80 gas valve adjustment',
    expect: 'manifold-pressure-single-stage-cv-s80',
    note: 'model without dash',
  },
  {
    query: 'two stage low fire pressure',
    expect: 'manifold-pressure-two-stage-cv-t96',
    note: 'plain wording',
  },
  {
    query: 'CVT96 high fire manifold',
    expect: 'manifold-pressure-two-stage-cv-t96',
    note: 'model without dash',
  },
  { query: 'CV-M98 minimum fire', expect: 'manifold-pressure-modulating-cv-m98', note: 'model with dash' },
  { query: 'CVM98 low fire', expect: 'manifold-pressure-modulating-cv-m98', note: 'model without dash' },
  {
    query: 'modulating furnace minimum rate',
    expect: 'manifold-pressure-modulating-cv-m98',
    note: 'plain wording',
  },

  // Fuel change, meter, altitude
  { query: 'LP conversion', expect: 'natural-gas-to-propane-conversion', note: 'synonym LP=propane' },
  { query: 'propane orifice', expect: 'natural-gas-to-propane-conversion', note: 'plural/singular orifices' },
  { query: 'LPG conversion kit', expect: 'natural-gas-to-propane-conversion', note: 'synonym LPG=propane' },
  { query: 'NG to propane', expect: 'natural-gas-to-propane-conversion', note: 'synonym NG=natural gas' },
  { query: 'clock gas meter', expect: 'clocking-the-gas-meter', note: 'stemming clock/clocking' },
  { query: 'btu input meter dial', expect: 'clocking-the-gas-meter', note: 'plain wording' },
  { query: 'high altitude derate', expect: 'high-altitude-derate', note: 'exact title words' },
  {
    query: 'elevation derating furnace',
    expect: 'high-altitude-derate',
    note: 'synonym elevation=altitude, stemming',
  },
  { query: 'hight altitude', expect: 'high-altitude-derate', note: 'typo' },

  // Airflow and blower
  {
    query: 'temperature rise blower speed',
    expect: 'temperature-rise-and-blower-speed',
    note: 'exact title words',
  },
  {
    query: 'temp rise too high',
    expect: 'temperature-rise-and-blower-speed',
    note: 'abbreviation temp=temperature',
  },
  {
    query: 'delta t furnace cfm',
    expect: 'temperature-rise-and-blower-speed',
    note: 'synonym delta t=temperature rise',
  },
  { query: 'ECM motor not running', expect: 'ecm-blower-motor-checks', note: 'abbreviation ECM' },
  {
    query: 'variable speed blower module',
    expect: 'ecm-blower-motor-checks',
    note: 'synonym variable-speed=ECM',
  },

  // Ignition and flame
  { query: 'furnace lights then shuts off', expect: 'flame-sensor-cleaning', note: 'plain-language symptom' },
  { query: 'flame sensors', expect: 'flame-sensor-cleaning', note: 'plural' },
  { query: 'flame rod microamps', expect: 'flame-sensor-cleaning', note: 'synonym flame rod=flame sensor' },
  { query: 'igniter chek', expect: 'hot-surface-igniter-checks', note: 'typo' },
  { query: 'HSI', expect: 'hot-surface-igniter-checks', note: 'abbreviation HSI=hot surface igniter' },
  {
    query: 'hot surface ignitor not glowing',
    expect: 'hot-surface-igniter-checks',
    note: 'spelling variant ignitor',
  },
  {
    query: 'CV-T96 flame sensor bulletin',
    expect: 'bulletin-cv-t96-flame-sensor-revision',
    note: 'model with dash, bulletin kind',
  },
  {
    query: 'service bulletin revised flame sensor',
    expect: 'bulletin-cv-t96-flame-sensor-revision',
    note: 'bulletin wording',
  },

  // Venting, drains and safeties
  {
    query: 'pressure switch wont close',
    expect: 'pressure-switch-faults',
    note: 'plain wording, stop words',
  },
  { query: 'pressure switches', expect: 'pressure-switch-faults', note: 'plural' },
  { query: 'inducer vacuum low', expect: 'pressure-switch-faults', note: 'related term' },
  { query: 'condensat trap', expect: 'condensate-trap-and-drain-problems', note: 'typo' },
  { query: 'condensate drain clogged', expect: 'condensate-trap-and-drain-problems', note: 'plain wording' },
  { query: 'rollout switch', expect: 'rollout-switch-trips', note: 'exact term' },
  { query: 'roll out switch tripped', expect: 'rollout-switch-trips', note: 'split word roll out=rollout' },
  { query: 'IFC flash codes', expect: 'cv-ifc-2-fault-codes', note: 'abbreviation IFC, synonym flash=blink' },
  { query: 'control board blink codes', expect: 'cv-ifc-2-fault-codes', note: 'synonym control board=IFC' },
  { query: 'CVIFC2 led', expect: 'cv-ifc-2-fault-codes', note: 'model without dashes' },

  // Combustion and air
  { query: 'air free CO', expect: 'flue-gas-co-and-air-free-co', note: 'abbreviation CO' },
  {
    query: 'carbon monoxide flue reading',
    expect: 'flue-gas-co-and-air-free-co',
    note: 'synonym carbon monoxide=CO',
  },
  { query: 'combustion air closet', expect: 'combustion-air-closet-install', note: 'exact title words' },
  {
    query: 'confined space water heater air openings',
    expect: 'combustion-air-closet-install',
    note: 'synonym confined space=closet',
  },

  // Boilers and water heaters
  {
    query: 'boiler keeps turning on and off',
    expect: 'combi-boiler-short-cycling',
    note: 'plain-language symptom',
  },
  {
    query: 'HB-C110 short cycle',
    expect: 'combi-boiler-short-cycling',
    note: 'model with dash, stemming cycle/cycling',
  },
  { query: 'HBC155 short cycling', expect: 'combi-boiler-short-cycling', note: 'model without dash' },
  { query: 'LWCO', expect: 'boiler-low-water-cutoff', note: 'abbreviation LWCO=low-water cutoff' },
  {
    query: 'low water cut off HB-F150',
    expect: 'boiler-low-water-cutoff',
    note: 'split word cut off=cutoff, model',
  },
  { query: 'T&P valve dripping', expect: 'water-heater-relief-valve', note: 'abbreviation T&P' },
  { query: 'relief valve leaking water heater', expect: 'water-heater-relief-valve', note: 'plain wording' },
  {
    query: 'water heater pilot goes out',
    expect: 'water-heater-pilot-and-thermocouple',
    note: 'plain-language symptom',
  },
  { query: 'thermocuple', expect: 'water-heater-pilot-and-thermocouple', note: 'typo' },
  {
    query: 'LPG tankless wont light',
    expect: 'tankless-ignition-faults-propane',
    note: 'synonym LPG=propane, stop words',
  },
  { query: 'HWT199 flame failure', expect: 'tankless-ignition-faults-propane', note: 'model without dash' },

  // Heat pump and AC
  {
    query: 'heat pump iced up',
    expect: 'heat-pump-defrost-problems',
    note: 'synonym ice/iced, plain wording',
  },
  { query: 'HP-36 defrost', expect: 'heat-pump-defrost-problems', note: 'model with dash' },
  { query: 'TXV', expect: 'ac-txv-and-refrigerant-charge-basics', note: 'abbreviation TXV=expansion valve' },
  {
    query: 'superheat subcooling HA30',
    expect: 'ac-txv-and-refrigerant-charge-basics',
    note: 'model without dash',
  },
  {
    query: 'refrigerant charging',
    expect: 'ac-txv-and-refrigerant-charge-basics',
    note: 'stemming charge/charging',
  },

  // Desk-only articles
  { query: 'warranty claim', expect: 'warranty-claim-rules', note: 'staff: exact words' },
  { query: 'warranty evidence control board', expect: 'warranty-claim-rules', note: 'staff: related terms' },
  {
    query: 'escalate to product specialist',
    expect: 'escalation-to-product-specialist',
    note: 'staff: stemming escalate/escalation',
  },
  {
    query: 'answering gas pressure questions',
    expect: 'desk-guidance-for-gas-pressure-questions',
    note: 'staff: plain wording',
  },
];
