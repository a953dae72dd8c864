// Certificate files (`.proof`), FORMAT.md §6.
//
// certificateFile is the whole language. A reader that streams a file calls
// nextCertificateStatement once per statement on one token stream instead, so no parse tree of
// the whole file is built; it then checks itself what certificateFile says about order (the
// header first; at most one digest, right after it). certificateStatementInContext is used only
// to report an error: it parses a statement together with the token that must follow it, so the
// message lists everything that could continue.
//
// Decisions where FORMAT.md is silent:
// - paramodulate: when only one substitution is written it is σA; write `{}` for an empty σA
//   to give σB alone. resolve needs no such rule: each substitution stands after its own
//   literal reference (`resolve A.i, B.j {y := a}` gives σB alone).
// - `{}`, the empty substitution, is allowed wherever a substitution is (see Logic.g4).
// - skolemize may omit `fresh` and its list: a step that only drops existentials whose
//   variable does not occur in their body introduces no symbol.
// - The digest string is checked after parsing: "sha256:" and 64 hexadecimal digits, in either
//   case.
parser grammar CertificateParser;

options { tokenVocab = AssayLexer; }

import Logic;

@header {package dev.assay.syntax.grammar;}

certificateFile
    : certificateHeader digest? (step | forget)* EOF
    ;

nextCertificateStatement
    : certificateStatement
    | EOF
    ;

certificateStatementInContext
    : certificateStatement (CERTIFICATE | DIGEST | STEP | FORGET | EOF)
    ;

certificateStatement
    : certificateHeader
    | digest
    | step
    | forget
    ;

certificateHeader
    : CERTIFICATE FOR IDENT
    ;

digest
    : DIGEST STRING
    ;

forget
    : FORGET IDENT (COMMA IDENT)*
    ;

step
    : STEP IDENT COLON conclusion BY inference
    ;

conclusion
    : FORMULA formula
    | CLAUSE clause
    ;

inference
    : negate
    | nnf
    | skolemize
    | clausify
    | define
    | abbreviate
    | resolve
    | factor
    | instantiate
    | paramodulate
    | eqres
    | eqfactor
    | reflexivity
    ;

// Rules that turn formulas into clauses

negate
    : NEGATE IDENT
    ;

nnf
    : NNF IDENT
    ;

skolemize
    : SKOLEMIZE IDENT (FRESH IDENT (COMMA IDENT)*)?
    ;

clausify
    : CLAUSIFY IDENT substitution?
    ;

define
    : DEFINE FRESH IDENT
    ;

abbreviate
    : ABBREVIATE IDENT USING IDENT
    ;

// Rules on clauses

resolve
    : RESOLVE literalRef substitution? COMMA literalRef substitution?
    ;

factor
    : FACTOR literalRef COMMA literalRef substitution?
    ;

instantiate
    : INSTANTIATE IDENT substitution
    ;

paramodulate
    : PARAMODULATE literalRef (RIGHT_ARROW | LEFT_ARROW) literalRef AT termPosition
      (substitution substitution?)?
    ;

eqres
    : EQRES literalRef substitution?
    ;

eqfactor
    : EQFACTOR literalRef COMMA literalRef substitution?
    ;

reflexivity
    : REFLEXIVITY
    ;
