/**
 * Neumaier's improved Kahan summation (Neumaier 1974, "Rundungsfehleranalyse einiger Verfahren
 * zur Summation endlicher Summen", ZAMM 54:39–51): the error of the running sum is carried
 * separately, so summing millions of terms loses no more than a rounding or two.
 */
export class CompensatedSum {
  private sum = 0;
  private compensation = 0;

  add(value: number): void {
    const total = this.sum + value;
    if (Math.abs(this.sum) >= Math.abs(value)) this.compensation += this.sum - total + value;
    else this.compensation += value - total + this.sum;
    this.sum = total;
  }

  get value(): number {
    return this.sum + this.compensation;
  }
}

/** Running ln Σ exp(x_i) without overflow or underflow. */
export class LogSum {
  private max = -Infinity;
  private scaled = 0;

  add(logValue: number): void {
    if (logValue === -Infinity) return;
    if (logValue <= this.max) this.scaled += Math.exp(logValue - this.max);
    else {
      this.scaled = this.scaled * Math.exp(this.max - logValue) + 1;
      this.max = logValue;
    }
  }

  get value(): number {
    return this.max === -Infinity ? -Infinity : this.max + Math.log(this.scaled);
  }
}
