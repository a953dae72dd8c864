// The tokens of the Assay problem and certificate languages, version 1 (FORMAT.md §1).
//
// One lexer serves both languages, so every keyword of either language is reserved in both:
// a problem cannot name a symbol `step` or `resolve` either. The keywords come before IDENT, so
// the longest-match rule with rule order makes `and` the keyword and `andy` an identifier.
//
// The lexer never fails: a character that starts no token becomes ILLEGAL_CHARACTER and a string
// that does not end on its line becomes UNTERMINATED_STRING, so the parser reports both at their
// place in the file, in file order with the syntax errors, with a message of its own.
lexer grammar AssayLexer;

@header {package dev.assay.syntax.grammar;}

// Statement keywords
PROBLEM     : 'problem' ;
DECLARE     : 'declare' ;
FUNCTION    : 'function' ;
PREDICATE   : 'predicate' ;
AXIOM       : 'axiom' ;
GOAL        : 'goal' ;
CERTIFICATE : 'certificate' ;
FOR         : 'for' ;
DIGEST      : 'digest' ;
STEP        : 'step' ;
FORMULA     : 'formula' ;
CLAUSE      : 'clause' ;
BY          : 'by' ;
FRESH       : 'fresh' ;
USING       : 'using' ;
FORGET      : 'forget' ;

// Logical keywords, each with its Unicode spelling
FORALL  : 'forall' | '∀' ;
EXISTS  : 'exists' | '∃' ;
NOT     : 'not' | '¬' ;
AND     : 'and' | '∧' ;
OR      : 'or' | '∨' ;
IMPLIES : 'implies' | '→' ;
IFF     : 'iff' | '↔' ;
TRUE    : 'true' | '⊤' ;
FALSE   : 'false' | '⊥' ;

// The rule names of FORMAT.md §6, reserved like the other keywords
NEGATE       : 'negate' ;
NNF          : 'nnf' ;
SKOLEMIZE    : 'skolemize' ;
CLAUSIFY     : 'clausify' ;
DEFINE       : 'define' ;
ABBREVIATE   : 'abbreviate' ;
RESOLVE      : 'resolve' ;
FACTOR       : 'factor' ;
INSTANTIATE  : 'instantiate' ;
PARAMODULATE : 'paramodulate' ;
EQRES        : 'eqres' ;
EQFACTOR     : 'eqfactor' ;
REFLEXIVITY  : 'reflexivity' ;

IDENT : [A-Za-z_] [A-Za-z0-9_]* ;

// Any run of digits; the parser's caller says where zero is not allowed, with a message that
// names the rule ("literal indices count from 1"), and rejects numbers that do not fit an int.
INT : [0-9]+ ;

// Only `digest` takes a string; its contents are checked after parsing.
STRING              : '"' ~["\r\n]* '"' ;
UNTERMINATED_STRING : '"' ~["\r\n]* ;

// Punctuation, in the order an error message lists what it expected
LPAREN      : '(' ;
COMMA       : ',' ;
RPAREN      : ')' ;
DOT         : '.' ;
COLON       : ':' ;
EQ          : '=' ;
NEQ         : '!=' | '≠' ;
ASSIGN      : ':=' | '↦' ;
LBRACKET    : '[' ;
RBRACKET    : ']' ;
LBRACE      : '{' ;
RBRACE      : '}' ;
RIGHT_ARROW : '->' ;
LEFT_ARROW  : '<-' ;
AT          : '@' ;
SLASH       : '/' ;

// A byte order mark is taken as white space, so a file saved with one still reads.
WHITESPACE : [ \t\r\n\f\uFEFF]+ -> skip ;
COMMENT    : '#' ~[\r\n]* -> skip ;

ILLEGAL_CHARACTER : . ;
