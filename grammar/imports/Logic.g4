// Terms, formulas, clauses, substitutions, literal references and term positions, shared by
// the problem and the certificate grammars (FORMAT.md §2 and §5). Imported, never compiled alone:
// the importing grammar supplies the tokens (tokenVocab = AssayLexer).
//
// Design and decisions where FORMAT.md is silent:
//
// - Precedence is spelled out as one rule per level, loosest first: formula (iff), implies, or,
//   and, unary (not, quantifier), primary. Every level is a loop or an option, not left
//   recursion, so the grammar stays LL-friendly; the caller folds `implies` to the right.
// - `iff` is non-associative: `a iff b iff c` is a syntax error; write parentheses.
// - A quantifier may stand wherever a `not` may, including as the last operand of a binary
//   connective, and its body extends as far right as possible: `a and forall x. P(x) or Q(x)` is
//   `a and (forall x. (P(x) or Q(x)))`, `not forall x. P(x)` is `not (forall x. P(x))`. The loops
//   below are greedy, which is what gives this reading. A body so extended is never followed
//   by `iff` of an enclosing formula (`forall x. a iff b iff c` is the same error as without the
//   quantifier); that check is done by the caller, since the grammar cannot say it LL-style.
// - An atom is a term, optionally compared with `=` or `!=` to another term; whether a name is
//   a variable or a symbol is decided later, by the layer that resolves names.
// - `f()` is not a term: a constant is written without parentheses.
// - A clause literal is an atom or `not` and an atom: no parentheses, no `true`, no double `not`.
//   `false` alone is the empty clause; it takes no variable bracket.
// - `{}`, the empty substitution, is allowed everywhere a substitution is.
// - Literal indices and term positions are written as plain numbers here; the caller rejects 0
//   ("literal indices count from 1").
parser grammar Logic;

term
    : IDENT (LPAREN term (COMMA term)* RPAREN)?
    ;

atom
    : term ((EQ | NEQ) term)?
    ;

formula
    : impliesFormula (IFF impliesFormula)?
    ;

impliesFormula
    : orFormula (IMPLIES orFormula)*
    ;

orFormula
    : andFormula (OR andFormula)*
    ;

andFormula
    : unaryFormula (AND unaryFormula)*
    ;

unaryFormula
    : NOT unaryFormula
    | quantifiedFormula
    | primaryFormula
    ;

quantifiedFormula
    : (FORALL | EXISTS) IDENT+ DOT formula
    ;

primaryFormula
    : TRUE
    | FALSE
    | atom
    | LPAREN formula RPAREN
    ;

clause
    : variableList? literal (OR literal)*
    | FALSE
    ;

variableList
    : LBRACKET IDENT (COMMA IDENT)* RBRACKET
    ;

literal
    : NOT? atom
    ;

substitution
    : LBRACE (binding (COMMA binding)*)? RBRACE
    ;

binding
    : IDENT ASSIGN term
    ;

literalRef
    : IDENT DOT INT
    ;

termPosition
    : INT (DOT INT)*
    ;
