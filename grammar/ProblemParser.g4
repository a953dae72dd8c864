// Problem files (`.problem`), FORMAT.md §3 and §4.
//
// problemFile is the whole language. A reader that streams a file calls nextProblemStatement
// once per statement on one token stream instead, so no parse tree of the whole file is built;
// it then checks itself what problemFile says about order (the header first, and only there).
// problemStatementInContext is used only to report an error: it parses a statement together
// with the token that must follow it, so the message lists everything that could continue.
//
// Decisions where FORMAT.md is silent:
// - An arity is any number, 0 included (`c/0`); positive numbers are for indices and positions.
// - Declarations, axioms and the goal may come in any order after the header.
parser grammar ProblemParser;

options { tokenVocab = AssayLexer; }

import Logic;

@header {package dev.assay.syntax.grammar;}

problemFile
    : problemHeader (declaration | axiom | goal)* EOF
    ;

nextProblemStatement
    : problemStatement
    | EOF
    ;

problemStatementInContext
    : problemStatement (PROBLEM | DECLARE | AXIOM | GOAL | EOF)
    ;

problemStatement
    : problemHeader
    | declaration
    | axiom
    | goal
    ;

problemHeader
    : PROBLEM IDENT
    ;

declaration
    : DECLARE (FUNCTION | PREDICATE) symbolArity (COMMA symbolArity)*
    ;

symbolArity
    : IDENT SLASH INT
    ;

axiom
    : AXIOM IDENT COLON formula
    ;

goal
    : GOAL IDENT COLON formula
    ;
