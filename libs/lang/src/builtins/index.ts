// Registers every builtin (imported for its side effect by evaluate and the language service).
import './core';
import './tuples';
import './wheel';
import './primes';
import './counts';
import './hl';
import './narrow';
import './data';
