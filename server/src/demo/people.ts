// Invented people for the demo: first and last names mixed at random, never a real passenger list.
import type { Random } from './random';

const FIRST = ['Avery', 'Bianca', 'Caio', 'Dalia', 'Emeka', 'Fiona', 'Goran', 'Hana', 'Idris', 'Jana', 'Kenji', 'Lucia',
  'Mateo', 'Nadia', 'Oskar', 'Priya', 'Quentin', 'Rosa', 'Samir', 'Talia', 'Ugo', 'Vera', 'Wendell', 'Ximena', 'Yusuf',
  'Zoe', 'Anouk', 'Bruno', 'Chiara', 'Dmitri', 'Elodie', 'Farah', 'Gideon', 'Ines', 'Jonas', 'Kaia', 'Leon', 'Marisol',
  'Niko', 'Olga', 'Paulo', 'Rania', 'Soren', 'Tomas', 'Uma', 'Viktor', 'Wren', 'Yara'] as const;
const LAST = ['Abernathy', 'Bellweather', 'Castellano', 'Dunmore', 'Esquivel', 'Fairbairn', 'Galloway', 'Hollis',
  'Ingersoll', 'Jarrow', 'Kestrel', 'Lindqvist', 'Marchetti', 'Nakamura', 'Okonkwo', 'Pemberton', 'Quillan', 'Rasmussen',
  'Santangelo', 'Thornbury', 'Underhill', 'Valdivia', 'Whitlock', 'Yardley', 'Zielinski', 'Ashcombe', 'Brightwater',
  'Corrigan', 'Delacroix', 'Ellsworth', 'Fennimore', 'Greenhalgh', 'Hartigan', 'Iverson', 'Juniper', 'Kowalczyk',
  'Lockhart', 'Moreau', 'Northcott', 'Ostrowski', 'Penhaligon', 'Redgrave', 'Stanhope', 'Tremblay', 'Vasquez',
  'Winterbourne'] as const;

export function personName(rng: Random) {
  return { firstName: rng.pick(FIRST), lastName: rng.pick(LAST) };
}

export function familyName(rng: Random) {
  return rng.pick(LAST);
}

export function firstName(rng: Random) {
  return rng.pick(FIRST);
}

const PNR_ALPHABET = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789'; // no I, O, 0, 1: read aloud at a counter without confusion
export function pnr(rng: Random) {
  let s = '';
  for (let i = 0; i < 6; i++) s += PNR_ALPHABET[Math.floor(rng.next() * PNR_ALPHABET.length)];
  return s;
}
