// Money typed and shown by people, in integer minor units of an ISO 4217 currency: one module for client and server.
export { currencyExponent, currencyProblem, MoneyCurrencyError } from './currency';
export { ISO_4217_EXPONENT_NOT_TWO, isoExponent } from './iso4217';
export { exampleAmount, formatMoney, minorToDecimalString, moneyInputText } from './format';
export { MAX_AMOUNT_MINOR, parseMoney, type MoneyParse, type MoneyParseOptions } from './parse';
export { numberSymbols, type NumberSymbols } from './symbols';
