//go:build js && wasm

package main

import (
	"context"
	"errors"
	"strconv"
	"syscall/js"

	"midrank/core/montecarlo"
)

// promised wraps a function of the API as guarded does, but runs it in a
// goroutine and answers with a Promise of its result: while the function
// waits (for the parts of a Monte Carlo estimate that other workers
// compute, see jsFarm), the worker's event loop runs and passes their
// answers in.
func promised(fn func([]js.Value) (string, error)) js.Func {
	call := guardedCall(fn)
	return js.FuncOf(func(_ js.Value, args []js.Value) any {
		var executor js.Func
		executor = js.FuncOf(func(_ js.Value, p []js.Value) any {
			resolve := p[0]
			go func() { resolve.Invoke(call(args)) }()
			return nil
		})
		promise := js.Global().Get("Promise").New(executor) // the executor runs at once
		executor.Release()
		return promise
	})
}

// jsFarm is a montecarlo.Farm made of the page's other workers, as the
// worker hands it in: {helpers: n, share(jobJSON, from, to) → Promise of the
// count}.
type jsFarm struct{ obj js.Value }

func (f jsFarm) Helpers() int { return f.obj.Get("helpers").Int() }

func (f jsFarm) Share(job []byte, from, to int) func() (int, error) {
	type answer struct {
		n   int
		err error
	}
	done := make(chan answer, 1)
	var then, fail js.Func
	settle := func(a answer) { then.Release(); fail.Release(); done <- a }
	then = js.FuncOf(func(_ js.Value, v []js.Value) any { settle(answer{n: v[0].Int()}); return nil })
	fail = js.FuncOf(func(_ js.Value, v []js.Value) any {
		settle(answer{err: errors.New("another worker could not compute its part of the Monte Carlo estimate: " + v[0].Call("toString").String())})
		return nil
	})
	f.obj.Call("share", string(job), from, to).Call("then", then, fail)
	return func() (int, error) { a := <-done; return a.n, a.err }
}

// farmOf reads the farm argument of call at index i: absent, or an object
// with helpers and share.
func farmOf(call string, args []js.Value, i int) (montecarlo.Farm, error) {
	if len(args) <= i || args[i].IsUndefined() || args[i].IsNull() {
		return nil, nil
	}
	if args[i].Type() != js.TypeObject || args[i].Get("helpers").Type() != js.TypeNumber || args[i].Get("share").Type() != js.TypeFunction {
		return nil, errors.New(call + ": the farm must be {helpers: a number, share: a function}")
	}
	return jsFarm{args[i]}, nil
}

// monteCarloPart computes a farm's part: the count of chunks [from, to)
// of a job that reach its observed statistic, as {"exceed": n}.
func monteCarloPart(args []js.Value) (string, error) {
	const call = "monteCarloPart(jobJSON, from, to)"
	if len(args) < 3 || args[0].Type() != js.TypeString {
		return "", errors.New(call + " needs the job and two whole numbers")
	}
	from, err := wholeOf(call, "from", args[1])
	if err != nil {
		return "", err
	}
	to, err := wholeOf(call, "to", args[2])
	if err != nil {
		return "", err
	}
	job, err := montecarlo.ParseJob([]byte(args[0].String()))
	if err != nil {
		return "", err
	}
	n, err := montecarlo.Part(context.Background(), job, from, to)
	if err != nil {
		return "", err
	}
	return `{"exceed":` + strconv.Itoa(n) + "}", nil
}
