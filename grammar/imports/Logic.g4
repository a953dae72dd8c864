// Terms, formulas, clauses, substitutions, literal references and term positions, shared by
// the problem and the certificate grammars (FORMAT.md §2 and §5). Imported, never compiled alone:
// the importing grammar supplies the tokens (tokenVocab = AssayLexer).
//
// Design and decisions where FORMAT.md is silent:
//
// - Precedence is spelled out as one rule per level, loosest first: formula (iff), implies, or,
//   and, unary (not, quantifier), primary. Every level is a loop, not left recursion, and every
//   decision of these rules is LL(1): SLL prediction is exact, and a full-LL parse costs no more.
// - A quantifier is parsed here as a prefix of its first operand, like `not`, and its body
//   extends as far right as possible: to the closing parenthesis around it or to the end of the
//   formula. `a and forall x. P(x) or Q(x)` is `a and (forall x. (P(x) or Q(x)))`, and
//   `not forall x. P(x) or Q` is `not (forall x. (P(x) or Q))`. The grammar cannot say "as far
//   right as possible" without an ambiguity that costs ANTLR a full-context prediction at every
//   connective (and, on a syntax error deep in nested quantifiers, time cubic in the depth), so
//   the code that builds the syntax tree applies it: it reads the operators of one parenthesis
//   level in order, with the precedence below, and gives a quantifier everything to its right.
// - `iff` is non-associative: `a iff b iff c` is an error (written with parentheses it is fine).
//   The formula rule accepts a chain so that `a iff forall x. b iff c`, which is
//   `a iff (forall x. (b iff c))`, parses; the builder rejects two `iff` at one level.
// - `implies` is right-associative: `a implies b implies c` is `a implies (b implies c)`.
// - Chains of `and` and of `or` become one n-ary node; parentheses are kept as written.
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
    : impliesFormula (IFF impliesFormula)*
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
    | quantifier unaryFormula
    | primaryFormula
    ;

quantifier
    : (FORALL | EXISTS) IDENT+ DOT
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
