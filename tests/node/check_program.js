#!/usr/bin/env node
// Reads a program written by dovetailor back with an independent G-code
// parser (the npm package gcode-parser) and checks it against a hand-written
// spec of what the post's control accepts, and against the end points the
// writer meant to reach.
//
// Usage: node check_program.js PROGRAM SPEC.json [POINTS.json [COMP.json]]
// COMP.json ({"radius": {"<D number>": radius}, "stock_y": [front, back]}, in
// program units) turns on the cutter radius compensation checks of the NIST
// RS274NGC Interpreter, Version 3 (NISTIR 6556, 2000; section 3.5.14 "Cutter
// Radius Compensation", from memory): compensation is not turned on while it
// is on; the first move after G41/G42 is a straight line (an arc there is an
// error) at least as long as the compensation radius; here also, both ends of
// the entry and of the G40 exit lie outside the stock (beyond its ends by the
// radius), and compensation is off at the end of the program.
// Exits 0 when every check passes; otherwise prints each problem with its
// line number and exits 1 (2 for a usage or setup problem).
'use strict';

const fs = require('fs');
const path = require('path');

let parser;
try {
  parser = require('gcode-parser');
} catch (e) {
  console.error(
    'check_program: the npm package gcode-parser is not installed.\n' +
      'Install it with:  npm ci --prefix ' + __dirname +
      '\n(' + e.message.split('\n')[0] + ')');
  process.exit(2);
}

const [programPath, specPath, pointsPath] = process.argv.slice(2);
if (!programPath || !specPath) {
  console.error('usage: node check_program.js PROGRAM SPEC.json [POINTS.json]');
  process.exit(2);
}
const text = fs.readFileSync(programPath, 'utf8');
const spec = JSON.parse(fs.readFileSync(specPath, 'utf8'));
const expectedPoints = pointsPath ? JSON.parse(fs.readFileSync(pointsPath, 'utf8')) : null;
const compPath = process.argv[5];
const comp = compPath ? JSON.parse(fs.readFileSync(compPath, 'utf8')) : null;
const nist = '(NISTIR 6556, 3.5.14)';
let compOn = false;
let compRadius = 0;
let entryPending = false;
let exitPending = false;
let dRegister = null;

const problems = [];
const problem = (lineNo, message) => problems.push(`${programPath}:${lineNo}: ${message}`);

if (!text.endsWith('\n')) problem(0, 'the last line has no newline');
const lines = text.split('\n');
if (lines[lines.length - 1] === '') lines.pop();

// Units of the program (G20 inch, G21 mm) decide which decimals apply.
const lengthLetters = new Set(['X', 'Y', 'Z', 'I', 'J', 'K', 'R']);
let units = null;
const position = { X: 0, Y: 0, Z: 0 };
let motion = null;
let pointIndex = 0;
let expectedNumber = spec.line_numbers ? spec.line_numbers.start : null;

function decimalsOf(raw) {
  const dot = raw.indexOf('.');
  return dot < 0 ? 0 : raw.length - dot - 1;
}

function checkStartEnd(lineNo, raw, expected) {
  const withoutN = raw.replace(/^N\d+ /, '');
  if (withoutN !== expected) problem(lineNo, `expected "${expected}", found "${raw}"`);
}

lines.forEach((raw, index) => {
  const lineNo = index + 1;
  if (raw.length > spec.max_line_length)
    problem(lineNo, `${raw.length} characters, more than max_line_length ${spec.max_line_length}`);
  if (/[^\x20-\x7e]/.test(raw)) problem(lineNo, 'characters outside printable ASCII');
  if (index < spec.start_lines.length) checkStartEnd(lineNo, raw, spec.start_lines[index]);
  const fromEnd = lines.length - index;
  if (fromEnd <= spec.end_lines.length)
    checkStartEnd(lineNo, raw, spec.end_lines[spec.end_lines.length - fromEnd]);
  if (raw === '%') return;

  const parsed = parser.parseLine(raw, { lineMode: 'compact' });

  // Comment style.
  if (spec.comments === 'parentheses' && raw.replace(/\([^)]*\)/g, '').includes(';'))
    problem(lineNo, 'semicolon comment, the post uses parentheses');
  if (spec.comments === 'semicolon' && raw.includes('('))
    problem(lineNo, 'parenthesised comment, the post uses semicolons');
  for (const c of parsed.comments || [])
    if (c.includes('(') || c.includes(')') || c.includes('%'))
      problem(lineNo, `comment "${c}" holds a character that ends or nests a comment`);

  // Line numbers.
  if (spec.line_numbers) {
    if (parsed.ln !== expectedNumber) problem(lineNo, `line number N${parsed.ln}, expected N${expectedNumber}`);
    expectedNumber += spec.line_numbers.step;
  } else if (parsed.ln !== undefined) {
    problem(lineNo, `line number N${parsed.ln} on a post without line numbers`);
  }

  // Every character outside comments must belong to a word the parser read;
  // the rest may only be parameter settings or expressions, if the post has them.
  let rest = parsed.line.replace(/^N\d+/, '');
  const words = [];
  const expressionAhead = () =>
    spec.parameters ? rest.match(/^(#\d+=[-+0-9.]+|#\d+=\[[^\]]*\]|[A-Z]\[[^\]]*\])/) : null;
  for (const [letter, value] of parsed.words) {
    for (let expr = expressionAhead(); expr; expr = expressionAhead()) {
      words.push({ letter: expr[0][0], expression: expr[0] });
      rest = rest.slice(expr[0].length);
    }
    const match = rest.match(/^([A-Za-z])([-+]?[0-9.]+)/);
    if (!match || match[1].toUpperCase() !== letter || Number(match[2]) !== value) {
      problem(lineNo, `the parser read ${letter}${value} but the line continues "${rest}"`);
      return;
    }
    words.push({ letter, value, raw: match[2] });
    rest = rest.slice(match[0].length);
  }
  for (let expr = expressionAhead(); expr; expr = expressionAhead()) {
    words.push({ letter: expr[0][0], expression: expr[0] });
    rest = rest.slice(expr[0].length);
  }
  if (rest.length > 0) {
    problem(lineNo, `text the parser could not read as words: "${rest}"` +
      (spec.parameters ? '' : ' (this post has no parameters or expressions)'));
    return;
  }

  const seen = new Set();
  const lineAxes = {};
  let hasAxis = false;
  let expressionAxis = false;
  const arc = {};
  for (const w of words) {
    if (w.letter === '#') continue;
    if (!spec.letters.includes(w.letter)) problem(lineNo, `letter ${w.letter} is not allowed for this post`);
    if (w.letter !== 'G' && w.letter !== 'M') {
      if (seen.has(w.letter)) problem(lineNo, `letter ${w.letter} twice`);
      seen.add(w.letter);
    }
    if (w.expression !== undefined) {
      if ('XYZ'.includes(w.letter)) { hasAxis = true; expressionAxis = true; }
      continue;
    }
    if (Object.is(w.value, -0) || /^-0*\.?0*$/.test(w.raw)) problem(lineNo, `negative zero ${w.letter}${w.raw}`);
    if (w.letter === 'G' || w.letter === 'M') {
      const allowed = w.letter === 'G' ? spec.g_codes : spec.m_codes;
      if (!allowed.includes(w.value)) problem(lineNo, `${w.letter}${w.raw} is not a code this control accepts`);
      if (spec.two_digit_codes && !/^\d\d/.test(w.raw)) problem(lineNo, `${w.letter}${w.raw} should have two digits`);
      if (!spec.two_digit_codes && /^0\d/.test(w.raw)) problem(lineNo, `${w.letter}${w.raw} has a leading zero`);
      if (w.letter === 'G' && w.value === 20) units = 'inch';
      if (w.letter === 'G' && w.value === 21) units = 'mm';
      if (w.letter === 'G' && [0, 1, 2, 3].includes(w.value)) motion = w.value;
      continue;
    }
    if (lengthLetters.has(w.letter)) {
      if (!w.raw.includes('.')) problem(lineNo, `${w.letter}${w.raw} has no decimal point`);
      if (units === null) problem(lineNo, `${w.letter} before any G20/G21`);
      else if (decimalsOf(w.raw) > spec.decimals[units])
        problem(lineNo, `${w.letter}${w.raw} has more than ${spec.decimals[units]} decimals`);
      if ('XYZ'.includes(w.letter)) { lineAxes[w.letter] = w.value; hasAxis = true; }
      else arc[w.letter] = w.value;
    }
    if (w.letter === 'F' && decimalsOf(w.raw) > spec.decimals.feed)
      problem(lineNo, `F${w.raw} has more than ${spec.decimals.feed} decimals`);
    if (w.letter === 'F' && !(w.value > 0)) problem(lineNo, `feed F${w.raw} is not positive`);
    if (['S', 'T', 'H', 'D'].includes(w.letter) && !/^\d+$/.test(w.raw))
      problem(lineNo, `${w.letter}${w.raw} should be a whole number`);
  }

  if (comp) {
    const gs = words.filter((w) => w.letter === 'G' && w.expression === undefined).map((w) => w.value);
    const d = words.find((w) => w.letter === 'D');
    if (d) dRegister = d.value;
    if (gs.includes(41) || gs.includes(42)) {
      if (compOn) problem(lineNo, `G41/G42 while compensation is already on ${nist}`);
      compOn = true;
      entryPending = true;
      compRadius = comp.radius[String(dRegister)];
      if (compRadius === undefined) problem(lineNo, `compensation with D${dRegister}, no radius known for it`);
    }
    if (gs.includes(40)) {
      exitPending = compOn;  // G40 in the modal set-up cancels nothing
      compOn = false;
    }
  }
  if (!hasAxis) return;
  const start = { ...position };
  Object.assign(position, lineAxes);
  if (comp && (entryPending || exitPending)) {
    const what = entryPending ? 'entry' : 'exit';
    if (motion !== 0 && motion !== 1) problem(lineNo, `compensation ${what} is not a straight move ${nist}`);
    const length = Math.hypot(position.X - start.X, position.Y - start.Y);
    if (entryPending && !(length >= compRadius - 1e-9))
      problem(lineNo, `compensation entry ${length} long, shorter than the radius ${compRadius} ${nist}`);
    const [front, back] = comp.stock_y;
    for (const y of [start.Y, position.Y])
      if (y > front - compRadius + 1e-9 && y < back + compRadius - 1e-9)
        problem(lineNo, `compensation ${what} at Y${y}, not outside the stock by the radius`);
    entryPending = false;
    exitPending = false;
  }
  // Arcs: the centre must be equally far from both ends (RS274NGC refuses a
  // difference above 0.0002 in / 0.002 mm, NISTIR 6556, from memory).
  if ((motion === 2 || motion === 3) && !expressionAxis) {
    const tolerance = units === 'inch' ? 0.0002 : 0.002;
    if (spec.arc_format === 'ijk') {
      if (arc.R !== undefined) problem(lineNo, 'R arc on a post that writes I J');
      const cx = start.X + (arc.I || 0), cy = start.Y + (arc.J || 0);
      const r0 = Math.hypot(start.X - cx, start.Y - cy), r1 = Math.hypot(position.X - cx, position.Y - cy);
      if (Math.abs(r0 - r1) > tolerance) problem(lineNo, `arc radius ${r0} at the start, ${r1} at the end`);
    } else {
      if (arc.I !== undefined || arc.J !== undefined) problem(lineNo, 'I J arc on a post that writes R');
      const chord = Math.hypot(position.X - start.X, position.Y - start.Y);
      if (arc.R === undefined || chord / 2 > Math.abs(arc.R) + tolerance)
        problem(lineNo, `arc chord ${chord} too long for R${arc.R}`);
    }
  }
  if (expectedPoints) {
    if (pointIndex >= expectedPoints.length) {
      problem(lineNo, 'more moves than expected end points');
      return;
    }
    const want = expectedPoints[pointIndex++];
    if (want === null || expressionAxis) return;
    const half = 0.5 * Math.pow(10, -spec.decimals[units]) + 1e-12;
    ['X', 'Y', 'Z'].forEach((axis, i) => {
      if (Math.abs(position[axis] - want[i]) > half)
        problem(lineNo, `${axis} ends at ${position[axis]}, expected ${want[i]}`);
    });
  }
});

if (comp && compOn) problem(lines.length, `the program ends with compensation on ${nist}`);
if (expectedPoints && pointIndex !== expectedPoints.length)
  problem(lines.length, `${pointIndex} moves read, ${expectedPoints.length} expected`);

if (problems.length > 0) {
  console.error(problems.join('\n'));
  console.error(`check_program: ${problems.length} problem(s) in ${programPath}`);
  process.exit(1);
}
console.log(`check_program: ${programPath}: ${lines.length} lines read back, all checks passed`);
