// States, territories and provinces as ISO 3166-2 codes, with the names the USDA distribution file uses.
export const REGIONS: Record<string, string> = {
  'US-AL': 'Alabama', 'US-AK': 'Alaska', 'US-AZ': 'Arizona', 'US-AR': 'Arkansas', 'US-CA': 'California',
  'US-CO': 'Colorado', 'US-CT': 'Connecticut', 'US-DE': 'Delaware', 'US-DC': 'District of Columbia',
  'US-FL': 'Florida', 'US-GA': 'Georgia', 'US-HI': 'Hawaii', 'US-ID': 'Idaho', 'US-IL': 'Illinois',
  'US-IN': 'Indiana', 'US-IA': 'Iowa', 'US-KS': 'Kansas', 'US-KY': 'Kentucky', 'US-LA': 'Louisiana',
  'US-ME': 'Maine', 'US-MD': 'Maryland', 'US-MA': 'Massachusetts', 'US-MI': 'Michigan', 'US-MN': 'Minnesota',
  'US-MS': 'Mississippi', 'US-MO': 'Missouri', 'US-MT': 'Montana', 'US-NE': 'Nebraska', 'US-NV': 'Nevada',
  'US-NH': 'New Hampshire', 'US-NJ': 'New Jersey', 'US-NM': 'New Mexico', 'US-NY': 'New York',
  'US-NC': 'North Carolina', 'US-ND': 'North Dakota', 'US-OH': 'Ohio', 'US-OK': 'Oklahoma', 'US-OR': 'Oregon',
  'US-PA': 'Pennsylvania', 'US-RI': 'Rhode Island', 'US-SC': 'South Carolina', 'US-SD': 'South Dakota',
  'US-TN': 'Tennessee', 'US-TX': 'Texas', 'US-UT': 'Utah', 'US-VT': 'Vermont', 'US-VA': 'Virginia',
  'US-WA': 'Washington', 'US-WV': 'West Virginia', 'US-WI': 'Wisconsin', 'US-WY': 'Wyoming',
  'US-PR': 'Puerto Rico', 'US-VI': 'Virgin Islands', 'US-GU': 'Guam', 'US-AS': 'American Samoa',
  'US-MP': 'Northern Mariana Islands', 'US-UM': 'U.S. Minor Outlying Islands',
  // freely associated states in USDA's distribution file: USPS codes, as ISO 3166-2 has no US subdivision for them
  'US-PW': 'Palau', 'US-MH': 'Marshall Islands', 'US-FM': 'Federated States of Micronesia',
  'CA-AB': 'Alberta', 'CA-BC': 'British Columbia', 'CA-MB': 'Manitoba', 'CA-NB': 'New Brunswick',
  'CA-NL': 'Newfoundland and Labrador', 'CA-NS': 'Nova Scotia', 'CA-NT': 'Northwest Territories',
  'CA-NU': 'Nunavut', 'CA-ON': 'Ontario', 'CA-PE': 'Prince Edward Island', 'CA-QC': 'Quebec',
  'CA-SK': 'Saskatchewan', 'CA-YT': 'Yukon',
}

export const REGION_CODES = Object.keys(REGIONS)

export function regionName(code: string): string {
  return REGIONS[code] ?? code
}

/** Regions sorted for a select box: US states first, then Canadian provinces. */
export const REGION_OPTIONS = Object.entries(REGIONS)
  .map(([code, name]) => ({ code, name }))
  .sort((a, b) => (a.code.slice(0, 2) === b.code.slice(0, 2) ? a.name.localeCompare(b.name) : a.code < b.code ? 1 : -1))
